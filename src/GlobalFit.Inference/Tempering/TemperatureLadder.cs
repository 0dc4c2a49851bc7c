namespace GlobalFit.Inference.Tempering;

/// <summary>
/// The inverse temperatures of a parallel-tempering run, the swap counters between neighbouring rungs
/// and the adaptive spacing of the rungs.
/// </summary>
/// <remarks>
/// <para>Initial ladder: geometric in T from 1 to <see cref="TemperingSettings.MaxTemperature"/>; with an
/// infinite maximum the finite rungs are spaced by a factor √10 and the last rung has β = 0 (it samples
/// the prior, which lets thermodynamic integration cover the whole [0, 1] range).</para>
/// <para>Adaptation: Vousden, Farr &amp; Mandel (2016), "Dynamic temperature selection for parallel
/// tempering in Markov chain Monte Carlo simulations", MNRAS 455, 1919, eqs. 10–13. With
/// S_i = ln(T_{i+1} − T_i) and A_i the swap acceptance between rungs i and i+1 in the latest round,
/// S_i ← S_i + κ(t) (A_i − A_{i+1}) with κ(t) = t₀ / (ν (t + t₀)); the coldest (T = 1) and hottest rungs
/// stay fixed, as in the authors' ptemcee. If an update would push an intermediate rung past the hottest
/// one (possible with a finite top), that round's update is skipped, which keeps the ladder ordered.</para>
/// <para>Not thread-safe.</para>
/// </remarks>
public sealed class TemperatureLadder
{
    private readonly TemperingSettings _settings;
    private readonly double[] _betas;
    private readonly double[] _newBetas;
    private readonly double[] _roundAcceptance;

    /// <summary>Creates the initial ladder for validated <paramref name="settings"/>.</summary>
    /// <param name="settings">The tempering settings.</param>
    public TemperatureLadder(TemperingSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        _settings = settings;
        int n = settings.TemperatureCount;
        _betas = new double[n];
        _newBetas = new double[n];
        _roundAcceptance = new double[Math.Max(n - 1, 0)];
        SwapsProposed = new long[Math.Max(n - 1, 0)];
        SwapsAccepted = new long[Math.Max(n - 1, 0)];
        _betas[0] = 1.0;
        bool infiniteTop = double.IsPositiveInfinity(settings.MaxTemperature);
        for (int i = 1; i < n; i++)
        {
            _betas[i] = infiniteTop
                ? (i == n - 1 ? 0.0 : Math.Pow(10.0, -0.5 * i))
                : Math.Pow(settings.MaxTemperature, -(double)i / (n - 1));
        }
    }

    /// <summary>Number of rungs.</summary>
    public int Count => _betas.Length;

    /// <summary>β of each rung, descending from 1.</summary>
    public ReadOnlySpan<double> InverseTemperatures => _betas;

    /// <summary>Swap attempts between rungs i and i+1, summed over replicas.</summary>
    public long[] SwapsProposed { get; }

    /// <summary>Accepted swaps between rungs i and i+1, summed over replicas.</summary>
    public long[] SwapsAccepted { get; }

    /// <summary>Number of swap rounds recorded so far (the adaptation clock t).</summary>
    public long Rounds { get; private set; }

    /// <summary>Accepted / attempted swaps per neighbouring pair (NaN before the first attempt).</summary>
    /// <returns>The rates.</returns>
    public System.Collections.Immutable.ImmutableArray<double> SwapAcceptanceRates()
    {
        var rates = System.Collections.Immutable.ImmutableArray.CreateBuilder<double>(SwapsProposed.Length);
        for (int i = 0; i < SwapsProposed.Length; i++)
        {
            rates.Add(SwapsProposed[i] == 0 ? double.NaN : (double)SwapsAccepted[i] / SwapsProposed[i]);
        }

        return rates.MoveToImmutable();
    }

    /// <summary>Records one swap round and adapts the spacing if adaptation is still on.</summary>
    /// <param name="acceptedPerPair">Accepted swaps per pair in this round.</param>
    /// <param name="replicas">Swap attempts per pair in this round (chains per temperature).</param>
    public void RecordRound(ReadOnlySpan<int> acceptedPerPair, int replicas)
    {
        for (int i = 0; i < _roundAcceptance.Length; i++)
        {
            SwapsProposed[i] += replicas;
            SwapsAccepted[i] += acceptedPerPair[i];
            _roundAcceptance[i] = (double)acceptedPerPair[i] / replicas;
        }

        if (_settings.AdaptLadder && Rounds < _settings.LadderAdaptationRounds && _betas.Length > 2)
        {
            Adapt();
        }

        Rounds++;
    }

    /// <summary>Restores a saved ladder.</summary>
    /// <param name="inverseTemperatures">Saved β values.</param>
    /// <param name="rounds">Saved round count.</param>
    /// <param name="swapsProposed">Saved swap attempts.</param>
    /// <param name="swapsAccepted">Saved accepted swaps.</param>
    /// <exception cref="ArgumentException">The saved ladder has a different number of rungs.</exception>
    public void Restore(ReadOnlySpan<double> inverseTemperatures, long rounds, ReadOnlySpan<long> swapsProposed, ReadOnlySpan<long> swapsAccepted)
    {
        if (inverseTemperatures.Length != _betas.Length || swapsProposed.Length != SwapsProposed.Length || swapsAccepted.Length != SwapsAccepted.Length)
        {
            throw new ArgumentException("Saved ladder does not match TemperatureCount.", nameof(inverseTemperatures));
        }

        inverseTemperatures.CopyTo(_betas);
        swapsProposed.CopyTo(SwapsProposed);
        swapsAccepted.CopyTo(SwapsAccepted);
        Rounds = rounds;
    }

    private void Adapt()
    {
        int n = _betas.Length;
        double kappa = _settings.AdaptationLag / (_settings.AdaptationTime * (Rounds + _settings.AdaptationLag));
        _newBetas[0] = _betas[0];
        _newBetas[n - 1] = _betas[n - 1];
        double temperature = 1.0 / _betas[0];
        for (int i = 0; i < n - 2; i++)
        {
            double spacing = 1.0 / _betas[i + 1] - 1.0 / _betas[i];
            temperature += spacing * Math.Exp(kappa * (_roundAcceptance[i] - _roundAcceptance[i + 1]));
            _newBetas[i + 1] = 1.0 / temperature;
        }

        if (_newBetas[n - 2] > _newBetas[n - 1])
        {
            _newBetas.CopyTo(_betas, 0);
        }
    }
}
