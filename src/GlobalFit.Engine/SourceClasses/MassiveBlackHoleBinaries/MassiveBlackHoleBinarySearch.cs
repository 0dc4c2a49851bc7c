using System.Numerics;
using GlobalFit.Inference.Random;
using GlobalFit.Physics.Detector;
using GlobalFit.Physics.MassiveBlackHoleBinaries;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.SourceClasses.MassiveBlackHoleBinaries;

/// <summary>The seed of a massive black-hole binary worker: a coarse matched-filter search of its residual over chirp mass
/// and mass ratio, maximised over the coalescence time and over a free complex amplitude in A and in E.</summary>
/// <remarks>
/// <para>For each grid point (chirp mass log-spaced by <c>search_chirp_mass_step</c> over the prior's range, mass ratio in
/// {1.5, 3, 6} up to the prior's largest, spins zero) the template is rendered once with t_c at the end of the prior's t_c
/// range and a fixed sky position and orientation. A shift of the template by Δt multiplies it by <c>e^{−2πifΔt}</c>, so the
/// overlaps <c>z_c(Δt) = 4Δf Σ_k d_k h_k* w_k e^{2πi f_k Δt}</c> at every Δt = jT/M (j = 0 … M − 1, T the record length, M
/// the next power of two above the window's bins) are one inverse FFT per channel; the best step is then refined between its
/// neighbours by golden-section search on the overlaps summed directly. Maximising each channel's
/// <c>ln Λ</c> over a free complex amplitude gives <c>|z_c|²/(2 (h_c|h_c))</c>; their sum over A and E is the statistic. This
/// is the standard frequency-domain matched filter maximised over time of arrival and phase (Allen et al. 2012,
/// PRD 85, 122006, arXiv:gr-qc/0509116, Sec. IV), with one amplitude per channel standing in for the sky, orientation
/// and distance, which at low frequency only scale and rotate A and E.</para>
/// <para>From the best grid point a Nelder–Mead ascent over chirp mass, mass ratio and a common aligned spin (at most 60 more
/// templates, rendered at the best t_c so far) walks along the mass-ratio–spin degeneracy the grid's zero spins leave. The best point gives chirp mass, mass ratio, spins and t_c; the distance is scaled so that the template's SNR equals the
/// statistic's <c>√(2 max)</c>. <see cref="RefineExtrinsic"/> then sets sky, orientation, phase and distance on the
/// heterodyned likelihood around that seed.
/// Approximations, acceptable for a seed: the shift treats the response as fixed over Δt (the constellation turns by
/// 2π Δt/yr), and the shifted template keeps the frequencies that the unshifted one emits before the data start.
/// Deterministic (no random numbers). Cost: one template and two FFTs of M points per template tried.</para>
/// </remarks>
public static class MassiveBlackHoleBinarySearch
{
    /// <summary>Sky position and orientation of the search templates (arbitrary, away from the constellation's blind
    /// directions).</summary>
    private const double FixedLatitudeRad = 0.4, FixedLongitudeRad = 1.0, FixedInclinationRad = 1.0, FixedPolarisationRad = 0.3;

    /// <summary>Mass ratios searched (those above the prior's largest are left out; 1.5 is always kept).</summary>
    private static readonly double[] MassRatios = [1.5, 3.0, 6.0];

    /// <summary>The seed found.</summary>
    /// <param name="Seed">Parameters of the best template (fixed sky and orientation).</param>
    /// <param name="Statistic">The maximised <c>ln Λ</c> there.</param>
    /// <param name="GridPoints">Grid templates tried (before the ascent).</param>
    public readonly record struct Result(MassiveBlackHoleBinaryParameters Seed, double Statistic, int GridPoints);

    /// <summary>Searches <paramref name="data"/>.</summary>
    /// <param name="orbits">The constellation.</param>
    /// <param name="data">Residual, weights and window (A and E are used).</param>
    /// <param name="prior">Ranges of chirp mass, mass ratio, t_c and distance.</param>
    /// <param name="recordS">Record length T = 1/Δf.</param>
    /// <param name="chirpMassStep">Step of ln 𝓜 between grid points.</param>
    /// <param name="startS">Start of the data: frequencies emitted earlier are left out of the templates.</param>
    /// <exception cref="ArgumentOutOfRangeException">The step is not positive.</exception>
    public static Result Run(IConstellationOrbits orbits, MassiveBlackHoleBinaryData data, MassiveBlackHoleBinaryPrior prior, double recordS, double chirpMassStep, double startS)
    {
        ArgumentNullException.ThrowIfNull(orbits);
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(prior);
        if (!(chirpMassStep > 0) || !double.IsFinite(chirpMassStep))
            throw new ArgumentOutOfRangeException(nameof(chirpMassStep), chirpMassStep, "chirp-mass step must be positive and finite");
        var filter = new Filter(orbits, data, prior, recordS, startS);
        int massCount = Math.Max(1, (int)Math.Ceiling(Math.Log(prior.MaximumChirpMassMsun / prior.MinimumChirpMassMsun) / chirpMassStep) + 1);
        var best = new Result(default, double.NegativeInfinity, 0);
        for (int i = 0; i < massCount; i++)
        {
            double chirpMass = Math.Min(prior.MaximumChirpMassMsun, prior.MinimumChirpMassMsun * Math.Exp(i * chirpMassStep));
            foreach (double q in MassRatios)
            {
                if (q > prior.MaximumMassRatio && q != MassRatios[0]) continue;
                var point = filter.Maximise(chirpMass, Math.Min(q, prior.MaximumMassRatio), 0, prior.LatestCoalescenceS);
                if (point.Statistic > best.Statistic) best = point;
            }
        }
        int gridPoints = filter.Templates;
        if (best.Statistic > double.NegativeInfinity) best = Polish(filter, best, prior, chirpMassStep);
        return best with { GridPoints = gridPoints };
    }

    // Nelder–Mead ascent (Nelder & Mead 1965, Computer Journal 7, 308; reflection 1, expansion 2, contraction ½, shrink ½)
    // from the best grid point over ln 𝓜, q and a common aligned spin χ1 = χ2, with templates rendered at the grid point's
    // t_c so that the shift is small and the frequencies emitted before the data start are cut as in the data. The grid's
    // spins are zero and its q coarse, so the chirp mass it picks is biased along the mass-ratio–spin degeneracy; the
    // simplex follows that ridge. At most PolishTemplates templates.
    private static Result Polish(Filter filter, Result start, MassiveBlackHoleBinaryPrior prior, double chirpMassStep)
    {
        var best = start;
        double Evaluate(double[] x)
        {
            double chirpMass = Math.Exp(x[0]);
            if (chirpMass < prior.MinimumChirpMassMsun || chirpMass > prior.MaximumChirpMassMsun || x[1] < 1 || x[1] > prior.MaximumMassRatio
                || Math.Abs(x[2]) > prior.MaximumSpin) return double.NegativeInfinity;
            var trial = filter.Maximise(chirpMass, x[1], x[2], start.Seed.CoalescenceTimeS);
            if (trial.Statistic > best.Statistic) best = trial;
            return trial.Statistic;
        }
        var p0 = start.Seed;
        double[][] simplex =
        [
            [Math.Log(p0.ChirpMassMsun), p0.MassRatio, p0.Spin1],
            [Math.Log(p0.ChirpMassMsun) + 0.5 * chirpMassStep, p0.MassRatio, p0.Spin1],
            [Math.Log(p0.ChirpMassMsun), Math.Min(p0.MassRatio + 0.5, prior.MaximumMassRatio), p0.Spin1],
            [Math.Log(p0.ChirpMassMsun), p0.MassRatio, p0.Spin1 + (p0.Spin1 > 0 ? -0.2 : 0.2)],
        ];
        var values = simplex.Select(Evaluate).ToArray();
        int used = 4;
        while (used < PolishTemplates)
        {
            var order = Enumerable.Range(0, 4).OrderByDescending(i => values[i]).ToArray();
            simplex = [.. order.Select(i => simplex[i])];
            values = [.. order.Select(i => values[i])];
            var centroid = new double[3];
            for (int i = 0; i < 3; i++)
                for (int d = 0; d < 3; d++) centroid[d] += simplex[i][d] / 3;
            double[] Along(double t) => [.. Enumerable.Range(0, 3).Select(d => centroid[d] + t * (simplex[3][d] - centroid[d]))];
            var reflected = Along(-1);
            double reflectedValue = Evaluate(reflected);
            used++;
            if (reflectedValue > values[0])
            {
                var expanded = Along(-2);
                double expandedValue = Evaluate(expanded);
                used++;
                (simplex[3], values[3]) = expandedValue > reflectedValue ? (expanded, expandedValue) : (reflected, reflectedValue);
            }
            else if (reflectedValue > values[2])
            {
                (simplex[3], values[3]) = (reflected, reflectedValue);
            }
            else
            {
                var contracted = Along(0.5);
                double contractedValue = Evaluate(contracted);
                used++;
                if (contractedValue > values[3])
                {
                    (simplex[3], values[3]) = (contracted, contractedValue);
                }
                else
                {
                    for (int i = 1; i < 4; i++)
                    {
                        for (int d = 0; d < 3; d++) simplex[i][d] = simplex[0][d] + 0.5 * (simplex[i][d] - simplex[0][d]);
                        values[i] = Evaluate(simplex[i]);
                        used++;
                    }
                }
            }
        }
        return best;
    }

    /// <summary>Templates the ascent after the grid may try.</summary>
    private const int PolishTemplates = 60;

    // The matched filter of one template maximised over time shift and per-channel amplitude; holds the buffers.
    private sealed class Filter(IConstellationOrbits orbits, MassiveBlackHoleBinaryData data, MassiveBlackHoleBinaryPrior prior, double recordS, double startS)
    {
        private readonly int _n = data.Window.Count;
        private readonly int _m = (int)BitOperations.RoundUpToPowerOf2((uint)data.Window.Count);
        private readonly MassiveBlackHoleBinaryTemplateGenerator _generator = new(orbits, data.Window.Count, startS);
        private readonly Complex[][] _h = [new Complex[data.Window.Count], new Complex[data.Window.Count], new Complex[data.Window.Count]];
        private readonly Complex[][] _products = [new Complex[data.Window.Count], new Complex[data.Window.Count]];
        private readonly double[] _norms = new double[2];
        private Complex[]? _buffer;
        private double[]? _power;

        public int Templates { get; private set; }

        // The template is rendered with t_c = referenceS; shifts reach every t_c of the prior's range (at most T long).
        public Result Maximise(double chirpMass, double q, double spin, double referenceS)
        {
            _buffer ??= new Complex[_m];
            _power ??= new double[_m];
            double tcEnd = prior.LatestCoalescenceS, tcStart = prior.EarliestCoalescenceS;
            var template = new MassiveBlackHoleBinaryParameters(chirpMass, q, spin, spin, referenceS, 1e4,
                FixedLatitudeRad, FixedLongitudeRad, FixedInclinationRad, FixedPolarisationRad, 0);
            _generator.RenderBins(template, data.Window, data.DfHz, _h[0], _h[1], _h[2]);
            Templates++;
            Array.Clear(_power);
            double templateNorm = 0;
            for (int c = 0; c < 2; c++)
            {
                double norm = InnerProduct.SquaredNorm(_h[c], data.InversePsd[c], data.DfHz);
                _norms[c] = norm;
                templateNorm += norm;
                if (!(norm > 0)) continue;
                var d = data.Channels[c];
                var w = data.InversePsd[c];
                var h = _h[c];
                var x = _products[c];
                for (int k = 0; k < _n; k++) x[k] = d[k] * Complex.Conjugate(h[k]) * (4 * data.DfHz * w[k]);
                Array.Clear(_buffer);
                x.CopyTo(_buffer, 0);
                ComplexDft.Inverse(_buffer);
                for (int j = 0; j < _m; j++)
                {
                    var z = _buffer[j];
                    _power[j] += (z.Real * z.Real + z.Imaginary * z.Imaginary) / (2 * norm);
                }
            }
            var best = new Result(template, double.NegativeInfinity, 0);
            if (!(templateNorm > 0)) return best;
            double step = recordS / _m, bestShift = double.NaN, bestPower = double.NegativeInfinity;
            for (int j = 0; j < _m; j++)
            {
                // Δt = j T/M shifts t_c later; shifts are circular over the record, so the same j is also the earlier shift (j − M) T/M.
                double shift = referenceS + j * step > tcEnd ? (j - _m) * step : j * step;
                double tc = referenceS + shift;
                if (tc < tcStart || tc > tcEnd || !(_power[j] > bestPower)) continue;
                bestPower = _power[j];
                bestShift = shift;
            }
            if (double.IsNaN(bestShift)) return best;
            // The grid's T/M steps are coarse next to the merger's period, so the peak is refined between the neighbouring
            // steps by golden-section search on the directly summed statistic.
            (bestShift, bestPower) = RefineShift(bestShift - step, bestShift + step, bestShift, bestPower);
            double tcBest = Math.Clamp(referenceS + bestShift, tcStart, tcEnd);
            double snr = Math.Sqrt(2 * bestPower);
            double distance = Math.Clamp(template.DistanceMpc * Math.Sqrt(templateNorm) / snr, prior.MinimumDistanceMpc, prior.MaximumDistanceMpc);
            best = new Result(template with { CoalescenceTimeS = tcBest, DistanceMpc = distance }, bestPower, 0);
            return best;
        }

        private (double Shift, double Power) RefineShift(double low, double high, double gridShift, double gridPower)
        {
            const double golden = 0.6180339887498949;
            double a = low, b = high;
            double x1 = b - golden * (b - a), x2 = a + golden * (b - a);
            double f1 = DirectPower(x1), f2 = DirectPower(x2);
            for (int iteration = 0; iteration < 16; iteration++)
            {
                if (f1 > f2)
                {
                    b = x2; x2 = x1; f2 = f1;
                    x1 = b - golden * (b - a); f1 = DirectPower(x1);
                }
                else
                {
                    a = x1; x1 = x2; f1 = f2;
                    x2 = a + golden * (b - a); f2 = DirectPower(x2);
                }
            }
            var (shift, power) = f1 > f2 ? (x1, f1) : (x2, f2);
            return power > gridPower ? (shift, power) : (gridShift, gridPower);
        }

        // Σ_c |z_c(Δt)|²/(2 N_c) with z_c(Δt) = Σ_k x_k e^{2πi f_k Δt}, summed directly (a phasor recurrence over the bins).
        private double DirectPower(double shift)
        {
            var start = Complex.FromPolarCoordinates(1, 2 * Math.PI * data.FrequencyOf(0) * shift);
            var turn = Complex.FromPolarCoordinates(1, 2 * Math.PI * data.DfHz * shift);
            double total = 0;
            for (int c = 0; c < 2; c++)
            {
                if (!(_norms[c] > 0)) continue;
                var x = _products[c];
                var phasor = start;
                Complex z = Complex.Zero;
                for (int k = 0; k < _n; k++)
                {
                    z += x[k] * phasor;
                    phasor *= turn;
                }
                total += (z.Real * z.Real + z.Imaginary * z.Imaginary) / (2 * _norms[c]);
            }
            return total;
        }
    }

    /// <summary>Sky position, inclination, polarisation, phase and distance of <paramref name="seed"/> by random draws on the
    /// heterodyned likelihood around it, with phase and distance maximised in closed form for each draw.</summary>
    /// <remarks>
    /// <para>With the intrinsic parameters fixed, the template's ratio to the reference is a smooth function of frequency (the
    /// ratio of two responses), which is what relative binning approximates well. The phase enters as an overall factor
    /// <c>e^{∓2iΔφ}</c> of every channel and the distance as <c>D₀/D</c>, so with the overlap O and norm N at the seed's
    /// distance D₀, <c>ln Λ(Δφ, D) = s (O₀ cos 2Δφ + O₁ sin 2Δφ) − ½ s² N</c> (s = D₀/D, O₁ the overlap at Δφ = π/4). Three
    /// evaluations give O₀, O₁ and N; the maximum is <c>(O₀² + O₁²)/(2N)</c> at <c>Δφ = ½ atan2(O₁, O₀)</c>,
    /// <c>s = √(O₀² + O₁²)/N</c>. Derived here from the linearity of the template in <c>e^{−2iφ_ref}</c> and in 1/D.</para>
    /// <para>Sky and orientation are drawn isotropically, the polarisation uniformly; the draw with the largest maximum wins
    /// (the seed itself counts as a draw). Deterministic for a given stream.</para>
    /// </remarks>
    /// <param name="likelihood">Heterodyned likelihood whose reference is <paramref name="seed"/>.</param>
    /// <param name="seed">The seed (intrinsic parameters and t_c kept).</param>
    /// <param name="prior">Distance range.</param>
    /// <param name="draws">Number of draws.</param>
    /// <param name="random">The stream of the draws.</param>
    /// <returns>The best parameters and their ln Λ.</returns>
    public static (MassiveBlackHoleBinaryParameters Best, double LogLikelihood) RefineExtrinsic(MassiveBlackHoleBinaryHeterodynedLikelihood likelihood,
        MassiveBlackHoleBinaryParameters seed, MassiveBlackHoleBinaryPrior prior, int draws, ref RandomStream random)
    {
        ArgumentNullException.ThrowIfNull(likelihood);
        ArgumentNullException.ThrowIfNull(prior);
        var best = seed;
        double bestValue = likelihood.LogLikelihoodRatio(seed);
        for (int i = 0; i <= draws; i++)
        {
            var trial = i == 0 ? seed : seed with
            {
                EclipticLatitudeRad = Math.Asin(random.NextUniform(-1, 1)),
                EclipticLongitudeRad = random.NextUniform(0, 2 * Math.PI),
                InclinationRad = Math.Acos(random.NextUniform(-1, 1)),
                PolarisationRad = random.NextUniform(0, Math.PI),
            };
            double d0 = trial.DistanceMpc, phi0 = trial.ReferencePhaseRad;
            double la = likelihood.LogLikelihoodRatio(trial);
            double lb = likelihood.LogLikelihoodRatio(trial with { ReferencePhaseRad = Wrap(phi0 + 0.25 * Math.PI, 2 * Math.PI) });
            double lc = likelihood.LogLikelihoodRatio(trial with { DistanceMpc = 2 * d0 });
            double norm = 4 * (2 * lc - la);
            if (!(norm > 0) || !double.IsFinite(norm)) continue;
            double o0 = la + 0.5 * norm, o1 = lb + 0.5 * norm;
            double overlap = Math.Sqrt(o0 * o0 + o1 * o1);
            double distance = Math.Clamp(d0 * norm / overlap, prior.MinimumDistanceMpc, prior.MaximumDistanceMpc);
            double s = d0 / distance;
            double value = s * overlap - 0.5 * s * s * norm;
            if (!(value > bestValue)) continue;
            bestValue = value;
            best = trial with { DistanceMpc = distance, ReferencePhaseRad = Wrap(phi0 + 0.5 * Math.Atan2(o1, o0), 2 * Math.PI) };
        }
        return (best, bestValue);
    }

    private static double Wrap(double value, double period) => ((value % period) + period) % period;
}
