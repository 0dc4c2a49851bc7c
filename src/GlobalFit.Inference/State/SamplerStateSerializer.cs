using MessagePack;

namespace GlobalFit.Inference.State;

/// <summary>MessagePack (standard resolver) serialisation of sampler states.</summary>
public static class SamplerStateSerializer
{
    /// <summary>Serialises a parallel-tempering state.</summary>
    /// <param name="state">The state.</param>
    /// <returns>The MessagePack bytes.</returns>
    public static byte[] Serialize(ParallelTemperingState state) =>
        MessagePackSerializer.Serialize(state, MessagePackSerializerOptions.Standard);

    /// <summary>Serialises a reversible-jump state.</summary>
    /// <param name="state">The state.</param>
    /// <returns>The MessagePack bytes.</returns>
    public static byte[] Serialize(ReversibleJumpState state) =>
        MessagePackSerializer.Serialize(state, MessagePackSerializerOptions.Standard);

    /// <summary>Reads a parallel-tempering state.</summary>
    /// <param name="bytes">Bytes from <see cref="Serialize(ParallelTemperingState)"/>.</param>
    /// <returns>The state.</returns>
    public static ParallelTemperingState DeserializeParallelTempering(ReadOnlyMemory<byte> bytes) =>
        MessagePackSerializer.Deserialize<ParallelTemperingState>(bytes, MessagePackSerializerOptions.Standard);

    /// <summary>Reads a reversible-jump state.</summary>
    /// <param name="bytes">Bytes from <see cref="Serialize(ReversibleJumpState)"/>.</param>
    /// <returns>The state.</returns>
    public static ReversibleJumpState DeserializeReversibleJump(ReadOnlyMemory<byte> bytes) =>
        MessagePackSerializer.Deserialize<ReversibleJumpState>(bytes, MessagePackSerializerOptions.Standard);
}
