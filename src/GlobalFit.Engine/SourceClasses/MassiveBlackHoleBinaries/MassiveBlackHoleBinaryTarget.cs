using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.Targets;
using GlobalFit.Physics.MassiveBlackHoleBinaries;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The posterior one massive black-hole binary worker samples: the heterodyned log-likelihood ratio of one binary
/// against the worker's residual, under <see cref="MassiveBlackHoleBinaryPrior"/> restricted to a box.</summary>
/// <remarks>
/// <para>The sampled vector is the eleven parameters in the order and units of
/// <see cref="MassiveBlackHoleBinaryParameters.ColumnNames"/>, so samples are written as they are drawn. Boundaries: periodic
/// for <c>lambda_rad</c> (2π), <c>psi_rad</c> (π) and <c>phi_ref_rad</c> (2π), reflecting for the others at the box's edges.</para>
/// <para>The box is the prior's support in the worker; a test may narrow it (then the prior is the same density truncated
/// to the box, and <see cref="DrawFromPrior"/> draws from that truncation by the inverse distribution function of each
/// independent factor), which keeps a coverage test's posteriors unimodal without changing what is tested.</para>
/// <para>The likelihood object is swapped by the worker when the residual or the reference changes
/// (<see cref="Likelihood"/>); within one block of steps it is fixed, so the target is. A parameter the waveform refuses
/// gives −∞. Not thread-safe (the likelihood holds buffers).</para>
/// </remarks>
public sealed class MassiveBlackHoleBinaryTarget : ITargetModel
{
    private const int Dimension = 11;
    private readonly double[] _lower;
    private readonly double[] _upper;
    private readonly double[] _unitLower = new double[Dimension];
    private readonly double[] _unitUpper = new double[Dimension];

    /// <summary>Creates the target over the prior's whole support.</summary>
    /// <param name="prior">The prior.</param>
    /// <param name="likelihood">The heterodyned likelihood, or null until the worker has a reference.</param>
    public MassiveBlackHoleBinaryTarget(MassiveBlackHoleBinaryPrior prior, MassiveBlackHoleBinaryHeterodynedLikelihood? likelihood)
        : this(prior, likelihood, null, null)
    {
    }

    /// <summary>Creates the target over the prior truncated to the box [<paramref name="lower"/>, <paramref name="upper"/>]
    /// (each bound null for the prior's own).</summary>
    /// <param name="prior">The prior.</param>
    /// <param name="likelihood">The heterodyned likelihood, or null until the worker has a reference.</param>
    /// <param name="lower">Lower corner in column order, or null.</param>
    /// <param name="upper">Upper corner in column order, or null.</param>
    /// <exception cref="ArgumentException">A corner does not hold eleven values, or the box misses the prior's support.</exception>
    public MassiveBlackHoleBinaryTarget(MassiveBlackHoleBinaryPrior prior, MassiveBlackHoleBinaryHeterodynedLikelihood? likelihood,
        double[]? lower, double[]? upper)
    {
        ArgumentNullException.ThrowIfNull(prior);
        Prior = prior;
        Likelihood = likelihood;
        double[] low = SupportLower(prior), high = SupportUpper(prior);
        if (lower is not null && lower.Length != Dimension) throw new ArgumentException("give eleven lower bounds", nameof(lower));
        if (upper is not null && upper.Length != Dimension) throw new ArgumentException("give eleven upper bounds", nameof(upper));
        _lower = new double[Dimension];
        _upper = new double[Dimension];
        for (int i = 0; i < Dimension; i++)
        {
            _lower[i] = Math.Max(low[i], lower?[i] ?? low[i]);
            _upper[i] = Math.Min(high[i], upper?[i] ?? high[i]);
            if (!(_upper[i] > _lower[i]))
                throw new ArgumentException($"the box misses the prior's support in {MassiveBlackHoleBinaryParameters.ColumnNames[i]}");
            _unitLower[i] = UnitCoordinate(i, _lower[i]);
            _unitUpper[i] = UnitCoordinate(i, _upper[i]);
        }
        var names = MassiveBlackHoleBinaryParameters.ColumnNames;
        Schema = new ParameterSchema(Enumerable.Range(0, Dimension).Select(i => new ParameterSpec(names[i], "", _lower[i], _upper[i],
            IsPeriodic(i) && _lower[i] == low[i] && _upper[i] == high[i] ? BoundaryKind.Periodic : BoundaryKind.Reflect)));
    }

    /// <summary>The prior.</summary>
    public MassiveBlackHoleBinaryPrior Prior { get; }

    /// <summary>The likelihood the next steps use (null: ln L = 0 everywhere).</summary>
    public MassiveBlackHoleBinaryHeterodynedLikelihood? Likelihood { get; set; }

    /// <inheritdoc />
    public ParameterSchema Schema { get; }

    /// <summary>Lower corner of the box, in column order.</summary>
    public ReadOnlySpan<double> Lower => _lower;

    /// <summary>Upper corner of the box, in column order.</summary>
    public ReadOnlySpan<double> Upper => _upper;

    /// <inheritdoc />
    public double LogPrior(ReadOnlySpan<double> theta)
    {
        for (int i = 0; i < Dimension; i++)
            if (!(theta[i] >= _lower[i] && theta[i] <= _upper[i])) return double.NegativeInfinity;
        return Prior.LogPrior(MassiveBlackHoleBinaryParameters.FromSpan(theta));
    }

    /// <inheritdoc />
    public void DrawFromPrior(Span<double> theta, ref RandomStream random)
    {
        Span<double> u = stackalloc double[Dimension];
        for (int i = 0; i < Dimension; i++) u[i] = random.NextUniform(_unitLower[i], _unitUpper[i]);
        var drawn = Prior.FromUnitCube(u).ToArray();
        for (int i = 0; i < Dimension; i++) theta[i] = Math.Clamp(drawn[i], _lower[i], _upper[i]);
    }

    /// <inheritdoc />
    public double LogLikelihood(ReadOnlySpan<double> theta)
    {
        if (Likelihood is null) return 0.0;
        try
        {
            double value = Likelihood.LogLikelihoodRatio(MassiveBlackHoleBinaryParameters.FromSpan(theta));
            return double.IsFinite(value) ? value : double.NegativeInfinity;
        }
        catch (ArgumentOutOfRangeException)
        {
            // A corner the waveform model refuses (it is checked inside the prior's box, but a model limit may be tighter).
            return double.NegativeInfinity;
        }
    }

    private static bool IsPeriodic(int i) => i is 7 or 9 or 10;

    private static double[] SupportLower(MassiveBlackHoleBinaryPrior p) =>
        [p.MinimumChirpMassMsun, 1.0, -p.MaximumSpin, -p.MaximumSpin, p.EarliestCoalescenceS, p.MinimumDistanceMpc, -0.5 * Math.PI, 0, 0, 0, 0];

    private static double[] SupportUpper(MassiveBlackHoleBinaryPrior p) =>
        [p.MaximumChirpMassMsun, p.MaximumMassRatio, p.MaximumSpin, p.MaximumSpin, p.LatestCoalescenceS, p.MaximumDistanceMpc, 0.5 * Math.PI, 2 * Math.PI, Math.PI, Math.PI, 2 * Math.PI];

    // The unit-cube coordinate of value x in dimension i: FromUnitCube is increasing in each coordinate separately, so
    // bisection inverts it (60 halvings reach double precision).
    private double UnitCoordinate(int i, double x)
    {
        Span<double> u = stackalloc double[Dimension];
        u.Fill(0.5);
        double a = 0, b = 1;
        for (int iteration = 0; iteration < 60; iteration++)
        {
            u[i] = 0.5 * (a + b);
            if (Prior.FromUnitCube(u).ToArray()[i] < x) a = u[i]; else b = u[i];
        }
        return 0.5 * (a + b);
    }
}
