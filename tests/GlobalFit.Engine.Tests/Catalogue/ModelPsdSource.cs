using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.Catalogue;

/// <summary>A fixed noise model as the engine's PSD source (what the noise worker's final model looks like to a catalogue).</summary>
internal sealed class ModelPsdSource(AetNoiseModel model, double dfHz) : IPsdSource
{
    public void FillPsd(AetChannel channel, BinWindow bins, Span<double> psd)
    {
        for (int k = 0; k < bins.Count; k++) psd[k] = model.Psd(channel, (bins.First + k) * dfHz);
    }
}
