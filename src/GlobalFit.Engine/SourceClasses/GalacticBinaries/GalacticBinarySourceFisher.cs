using System.Numerics;
using GlobalFit.Inference.Targets;
using GlobalFit.Physics.GalacticBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.GalacticBinaries;

/// <summary>The Fisher matrix of one galactic binary in the sampled coordinates, by central differences of its
/// templates over the window: <c>F_ij = (∂_i h | ∂_j h)</c>.</summary>
/// <remarks>The standard high-SNR approximation of the inverse posterior covariance (Cutler &amp; Flanagan 1994, PRD 49,
/// 2658, cited from memory; Cornish &amp; Crowder 2005, PRD 72, 043005, for this use as a proposal). 16 templates per
/// matrix. Steps: 10⁻³ bins in f0, 5 % of the prior width in ḟ (the phase π ḟ t² is linear in ḟ, so a large step costs no accuracy,
/// while a small one drowns the tiny derivative of a short record in the template's round-off), 10⁻⁴ relative in ρ̂ and 10⁻⁴ in the dimensionless and
/// angular coordinates. 1/width² of each prior range is added to the diagonal: parameters the data do not constrain
/// (ḟ over a short record) then get steps of the prior's size instead of the near-infinite steps of a singular matrix.
/// Not thread-safe (it shares the worker's generator and owns scratch spectra).</remarks>
public sealed class GalacticBinarySourceFisher : IFisherInformation
{
    private readonly GalacticBinaryTemplateGenerator _generator;
    private readonly GalacticBinaryBand _band;
    private readonly double _snrScale;
    private readonly double _derivativeStep;
    private readonly Complex[][] _derivatives;
    private readonly double[] _shifted = new double[GalacticBinarySourceVector.Dimension];
    private readonly double[] _priorPrecision = new double[GalacticBinarySourceVector.Dimension];

    /// <summary>Creates the Fisher information of sources in <paramref name="band"/>.</summary>
    /// <param name="generator">The worker's generator.</param>
    /// <param name="band">The residual (for its window and inverse PSDs).</param>
    /// <param name="snrScale">s of the window.</param>
    /// <param name="schema">The prior's schema; 1/width² of each parameter is added to the diagonal.</param>
    public GalacticBinarySourceFisher(GalacticBinaryTemplateGenerator generator, GalacticBinaryBand band, double snrScale, Inference.Parameters.ParameterSchema schema)
    {
        ArgumentNullException.ThrowIfNull(schema);
        for (int i = 0; i < _priorPrecision.Length; i++) _priorPrecision[i] = 1.0 / (schema.Parameters[i].Width * schema.Parameters[i].Width);
        double derivativeRangeHzS = schema.Parameters[GalacticBinarySourceVector.FrequencyDerivative].Width;
        _generator = generator ?? throw new ArgumentNullException(nameof(generator));
        _band = band ?? throw new ArgumentNullException(nameof(band));
        _snrScale = snrScale;
        _derivativeStep = 0.05 * derivativeRangeHzS;
        int channels = band.IncludesT ? 3 : 2;
        _derivatives = new Complex[GalacticBinarySourceVector.Dimension * channels][];
        for (int i = 0; i < _derivatives.Length; i++) _derivatives[i] = new Complex[band.Window.Count];
    }

    /// <inheritdoc />
    public int Dimension => GalacticBinarySourceVector.Dimension;

    /// <summary>Where the Fisher matrices are timed.</summary>
    internal BandUpdateClock Clock { get; set; } = new();

    /// <inheritdoc />
    public void FisherMatrix(ReadOnlySpan<double> theta, Span<double> matrix)
    {
        long started = BandUpdateClock.Now();
        Compute(theta, matrix);
        Clock.Add(BandUpdatePhase.Fisher, started);
    }

    private void Compute(ReadOnlySpan<double> theta, Span<double> matrix)
    {
        int d = Dimension, channels = _band.IncludesT ? 3 : 2;
        for (int i = 0; i < d; i++)
        {
            double step = Step(i, theta);
            Span<Complex> a = _derivatives[i * channels], e = _derivatives[i * channels + 1];
            Span<Complex> t = channels == 3 ? _derivatives[i * channels + 2] : Span<Complex>.Empty;
            a.Clear();
            e.Clear();
            t.Clear();
            Render(theta, i, step, a, e, t);
            Scale(a, -1.0);
            Scale(e, -1.0);
            Scale(t, -1.0);
            Render(theta, i, -step, a, e, t);
            // Now a = h(θ − δ) − h(θ + δ); the sign flips back in the division.
            double factor = -1.0 / (2.0 * step);
            Scale(a, factor);
            Scale(e, factor);
            Scale(t, factor);
        }
        for (int i = 0; i < d; i++)
        {
            for (int j = i; j < d; j++)
            {
                double value = InnerProduct.Real(_derivatives[i * channels], _derivatives[j * channels], _band.InverseA, _band.DfHz)
                    + InnerProduct.Real(_derivatives[i * channels + 1], _derivatives[j * channels + 1], _band.InverseE, _band.DfHz);
                if (channels == 3)
                    value += InnerProduct.Real(_derivatives[i * channels + 2], _derivatives[j * channels + 2], _band.InverseT!, _band.DfHz);
                if (i == j) value += _priorPrecision[i];
                matrix[i * d + j] = value;
                matrix[j * d + i] = value;
            }
        }
    }

    private double Step(int index, ReadOnlySpan<double> theta) => index switch
    {
        GalacticBinarySourceVector.Frequency => 1e-3 * _band.DfHz,
        GalacticBinarySourceVector.FrequencyDerivative => _derivativeStep,
        GalacticBinarySourceVector.Snr => 1e-4 * Math.Max(theta[index], 1.0),
        _ => 1e-4,
    };

    private void Render(ReadOnlySpan<double> theta, int index, double step, Span<Complex> a, Span<Complex> e, Span<Complex> t)
    {
        theta.CopyTo(_shifted);
        _shifted[index] += step;
        _generator.AddResponse(GalacticBinarySourceVector.ToParameters(_shifted, _snrScale), _band.Window, a, e, t);
    }

    private static void Scale(Span<Complex> values, double factor)
    {
        for (int k = 0; k < values.Length; k++) values[k] *= factor;
    }
}
