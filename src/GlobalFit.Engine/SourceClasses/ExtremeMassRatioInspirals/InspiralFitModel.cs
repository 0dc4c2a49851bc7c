using System.Numerics;
using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;
using GlobalFit.Physics.ExtremeMassRatioInspirals;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.ExtremeMassRatioInspirals;

/// <summary>The target an inspiral worker samples: the inspiral prior and the fast-path log-likelihood ratio against
/// one update's residual, in the worker's scaled coordinates (<see cref="InspiralSamplingCoordinates"/>), with the
/// Fisher matrix for jumps along its eigen-directions.</summary>
/// <remarks>
/// <para>Support: the prior's, further cut to a box of ± <c>boxSigma</c> scaled units around the reference in every
/// non-periodic coordinate. The box is many posterior widths wide (its edges only stop hot chains from wandering off to
/// templates that share no bin with the window); inside it the density is the prior's times the Jacobian of the
/// coordinates, so the cold chain's posterior is the inspiral posterior as long as it lies well inside the box.
/// <see cref="DrawFromPrior"/> draws uniformly in the box: it seeds the differential-evolution archive and the
/// sampler's first positions (which the worker then moves to its start); no proposal uses it as a density.</para>
/// <para>Fisher matrix: F_ij = (∂_i h | ∂_j h) over A and E on the window (the linear-signal approximation of
/// Vallisneri 2008, Phys. Rev. D 77, 042001, eq. 5), by central differences of step
/// <see cref="FisherStep"/> scaled units, one-sided where a step leaves the support.</para>
/// <para>Not thread-safe (it owns the likelihood's buffers).</para>
/// </remarks>
internal sealed class InspiralFitModel : ITargetModel, IFisherInformation
{
    /// <summary>Central-difference step of the Fisher matrix, in scaled units (posterior widths at the start).</summary>
    public const double FisherStep = 0.05;

    private readonly ExtremeMassRatioInspiralPrior _prior;
    private readonly InspiralSamplingCoordinates _coordinates;
    private readonly ExtremeMassRatioInspiralLikelihood _likelihood;
    private readonly ExtremeMassRatioInspiralTemplateGenerator _generator;
    private readonly BinWindow _window;
    private readonly double[] _inverseA, _inverseE;
    private readonly Complex[] _dataA, _dataE;
    private readonly double[] _lower, _upper;

    /// <summary>Creates the model for one update.</summary>
    public InspiralFitModel(ExtremeMassRatioInspiralPrior prior, InspiralSamplingCoordinates coordinates, double boxSigma,
        ExtremeMassRatioInspiralTemplateGenerator generator, BinWindow window, Complex[] dataA, Complex[] dataE, double[] inverseA, double[] inverseE)
    {
        _prior = prior;
        _coordinates = coordinates;
        _generator = generator;
        _window = window;
        _inverseA = inverseA;
        _inverseE = inverseE;
        _dataA = dataA;
        _dataE = dataE;
        _likelihood = new ExtremeMassRatioInspiralLikelihood(generator, window, dataA, dataE, inverseA, inverseE);
        (_lower, _upper) = (new double[InspiralSamplingCoordinates.Dimension], new double[InspiralSamplingCoordinates.Dimension]);
        ReadOnlySpan<double> low = [Math.Log(prior.MinCentralMassMsun), Math.Log(prior.MinCompactMassMsun), 0, prior.MinFrequencyHz, 0, -1, -1, 0, -1, 0, Math.Log(prior.MinDistanceMpc), 0, 0, 0];
        ReadOnlySpan<double> high = [Math.Log(prior.MaxCentralMassMsun), Math.Log(prior.MaxCompactMassMsun), prior.MaxSpin, prior.MaxFrequencyHz, prior.MaxEccentricity, 1, 1, 2 * Math.PI, 1, 2 * Math.PI, Math.Log(prior.MaxDistanceMpc), 2 * Math.PI, 2 * Math.PI, 2 * Math.PI];
        var specs = new ParameterSpec[InspiralSamplingCoordinates.Dimension];
        for (int i = 0; i < specs.Length; i++)
        {
            double s = coordinates.Scales[i], r = coordinates.Reference[i];
            bool periodic = InspiralSamplingCoordinates.IsPeriodic(i);
            _lower[i] = periodic ? (low[i] - r) / s : Math.Max((low[i] - r) / s, -boxSigma);
            _upper[i] = periodic ? (high[i] - r) / s : Math.Min((high[i] - r) / s, boxSigma);
            specs[i] = new ParameterSpec(ExtremeMassRatioInspiralParameters.ColumnNames[i] + "_scaled", "1", _lower[i], _upper[i],
                periodic ? BoundaryKind.Periodic : BoundaryKind.Reflect);
        }
        Schema = new ParameterSchema(specs);
    }

    /// <inheritdoc />
    public ParameterSchema Schema { get; }

    /// <summary>Number of parameters, 14.</summary>
    public int Dimension => InspiralSamplingCoordinates.Dimension;

    /// <summary>The coordinates.</summary>
    public InspiralSamplingCoordinates Coordinates => _coordinates;

    /// <inheritdoc />
    public double LogPrior(ReadOnlySpan<double> theta)
    {
        for (int i = 0; i < theta.Length; i++)
            if (!(theta[i] >= _lower[i] && theta[i] <= _upper[i])) return double.NegativeInfinity;
        var p = _coordinates.ToParameters(theta);
        double value = _prior.LogDensity(p) + InspiralSamplingCoordinates.LogJacobian(p);
        return double.IsNaN(value) || double.IsPositiveInfinity(value) ? double.NegativeInfinity : value;
    }

    /// <inheritdoc />
    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        for (int i = 0; i < theta.Length; i++) theta[i] = random.NextUniform(_lower[i], _upper[i]);
    }

    /// <inheritdoc />
    public double LogLikelihood(ReadOnlySpan<double> theta) => LogLikelihood(_coordinates.ToParameters(theta));

    /// <summary>ln L of physical parameters; −∞ when the template cannot be built for them.</summary>
    public double LogLikelihood(in ExtremeMassRatioInspiralParameters p)
    {
        try
        {
            return _likelihood.LogLikelihoodRatio(p);
        }
        catch (ArgumentOutOfRangeException)
        {
            // Only reached for parameters the prior lets through but the orbit integration refuses (e.g. a source
            // that plunges before the first coarse node); such a point has no template and is simply not proposed to.
            return double.NegativeInfinity;
        }
    }

    /// <inheritdoc />
    public void FisherMatrix(ReadOnlySpan<double> theta, Span<double> matrix) => FisherAndGradient(theta, matrix, Span<double>.Empty);

    /// <summary>The Fisher matrix at <paramref name="theta"/> and, when <paramref name="gradient"/> is not empty, the
    /// gradient of ln L in the linear-signal approximation, g_i = (d − h | ∂_i h).</summary>
    /// <param name="theta">Scaled coordinates.</param>
    /// <param name="matrix">d×d output, row-major.</param>
    /// <param name="gradient">d outputs, or empty.</param>
    public void FisherAndGradient(ReadOnlySpan<double> theta, Span<double> matrix, Span<double> gradient)
    {
        int d = Dimension, n = _window.Count;
        var derivativesA = new Complex[d][];
        var derivativesE = new Complex[d][];
        Span<double> shifted = stackalloc double[d];
        var plusA = new Complex[n]; var plusE = new Complex[n];
        var minusA = new Complex[n]; var minusE = new Complex[n];
        for (int i = 0; i < d; i++)
        {
            theta.CopyTo(shifted);
            shifted[i] = theta[i] + FisherStep;
            bool up = double.IsFinite(LogPrior(shifted));
            shifted[i] = theta[i] - FisherStep;
            bool down = double.IsFinite(LogPrior(shifted));
            double upStep = up ? FisherStep : 0, downStep = down ? FisherStep : 0;
            derivativesA[i] = new Complex[n];
            derivativesE[i] = new Complex[n];
            if (upStep + downStep == 0) continue;
            shifted[i] = theta[i] + upStep;
            Template(shifted, plusA, plusE);
            shifted[i] = theta[i] - downStep;
            Template(shifted, minusA, minusE);
            double inverse = 1.0 / (upStep + downStep);
            var (da, de) = (derivativesA[i], derivativesE[i]);
            for (int k = 0; k < n; k++)
            {
                da[k] = (plusA[k] - minusA[k]) * inverse;
                de[k] = (plusE[k] - minusE[k]) * inverse;
            }
        }
        double df = _generator.FrequencyResolutionHz;
        for (int i = 0; i < d; i++)
            for (int j = i; j < d; j++)
            {
                double f = InnerProduct.Real(derivativesA[i], derivativesA[j], _inverseA, df) + InnerProduct.Real(derivativesE[i], derivativesE[j], _inverseE, df);
                matrix[i * d + j] = f;
                matrix[j * d + i] = f;
            }
        if (gradient.IsEmpty) return;
        Template(theta, plusA, plusE);
        for (int k = 0; k < n; k++)
        {
            plusA[k] = _dataA[k] - plusA[k];
            plusE[k] = _dataE[k] - plusE[k];
        }
        for (int i = 0; i < d; i++)
            gradient[i] = InnerProduct.Real(plusA, derivativesA[i], _inverseA, df) + InnerProduct.Real(plusE, derivativesE[i], _inverseE, df);
    }

    /// <summary>The template of scaled coordinates <paramref name="theta"/> over the window (outputs cleared first).</summary>
    public void Template(ReadOnlySpan<double> theta, Complex[] a, Complex[] e) => Template(_coordinates.ToParameters(theta), a, e);

    /// <summary>The template of <paramref name="p"/> over the window (outputs cleared first; left zero when the
    /// template cannot be built).</summary>
    public void Template(in ExtremeMassRatioInspiralParameters p, Complex[] a, Complex[] e)
    {
        Array.Clear(a);
        Array.Clear(e);
        try
        {
            _generator.AddResponse(p, _window, a, e, Span<Complex>.Empty);
        }
        catch (ArgumentOutOfRangeException)
        {
            Array.Clear(a);
            Array.Clear(e);
        }
    }
}
