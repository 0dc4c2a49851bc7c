namespace GlobalFit.Physics.Detector;

/// <summary>The six one-way link measurements as functions of continuous time, with their light times.</summary>
/// <remarks>The input to <see cref="MichelsonTdi"/>. Link ij is the measurement made on spacecraft i of the beam
/// sent by spacecraft j (our convention; papers differ in the order of the two indices). Implementations that wrap analytic signals can
/// evaluate any time exactly, so TDI needs no interpolation.</remarks>
public interface IOneWayLinks
{
    /// <summary>Light travel time <c>L_ij/c</c> of the beam received at <paramref name="receiver"/> at
    /// <paramref name="receptionTimeSeconds"/> from <paramref name="sender"/>; it defines the delay operator
    /// <c>D_ij z(t) = z(t − L_ij(t)/c)</c>.</summary>
    /// <value>s.</value>
    double LightTimeSeconds(int receiver, int sender, double receptionTimeSeconds);

    /// <summary>The one-way measurement <c>y_ij</c> (fractional frequency) at reception time <paramref name="receptionTimeSeconds"/>.</summary>
    double Measurement(int receiver, int sender, double receptionTimeSeconds);
}
