using GlobalFit.Inference.Parameters;

namespace GlobalFit.Engine.SourceClasses.Noise;

/// <summary>The sampled vector of the noise fit: which levels it holds, in which order, with which bounds, and how
/// it maps to PSD coefficients and to the reported ASDs.</summary>
/// <remarks>Inside the sampler the instrument levels are ASD multipliers relative to the starting ASDs (order 1, so
/// the proposals are well scaled) and the foreground level is its amplitude. Order: <c>acceleration_asd_ae_m_s2_rthz, oms_asd_ae_m_rthz[, acceleration_asd_t_m_s2_rthz,
/// oms_asd_t_m_rthz][, foreground_amplitude_relative]</c>. All bounds reject (rather than reflect) so that the independence proposal's density
/// stays exact.</remarks>
internal sealed class NoiseParameterLayout
{
    private readonly NoiseFitSettings _settings;

    public NoiseParameterLayout(NoiseFitSettings settings)
    {
        _settings = settings;
        var names = new List<string> { "acceleration_asd_ae_m_s2_rthz", "oms_asd_ae_m_rthz" };
        var specs = new List<ParameterSpec>
        {
            new("acceleration_asd_ae_m_s2_rthz", "", settings.LevelPriorMin, settings.LevelPriorMax, BoundaryKind.Reject),
            new("oms_asd_ae_m_rthz", "", settings.LevelPriorMin, settings.LevelPriorMax, BoundaryKind.Reject),
        };
        if (settings.IncludeT)
        {
            AccelerationT = names.Count;
            OmsT = names.Count + 1;
            names.AddRange(["acceleration_asd_t_m_s2_rthz", "oms_asd_t_m_rthz"]);
            specs.Add(new("acceleration_asd_t_m_s2_rthz", "", settings.LevelPriorMin, settings.LevelPriorMax, BoundaryKind.Reject));
            specs.Add(new("oms_asd_t_m_rthz", "", settings.LevelPriorMin, settings.LevelPriorMax, BoundaryKind.Reject));
        }
        if (settings.Foreground)
        {
            Foreground = names.Count;
            names.Add("foreground_amplitude_relative");
            specs.Add(new("foreground_amplitude_relative", "", 0.0, settings.ForegroundAmplitudeMax, BoundaryKind.Reject));
        }
        Names = [.. names];
        Schema = new ParameterSchema(specs);
    }

    /// <summary>Index of acceleration_asd_ae_m_s2_rthz.</summary>
    public int AccelerationAe => 0;

    /// <summary>Index of oms_asd_ae_m_rthz.</summary>
    public int OmsAe => 1;

    /// <summary>Index of acceleration_asd_t_m_s2_rthz, or −1.</summary>
    public int AccelerationT { get; } = -1;

    /// <summary>Index of oms_asd_t_m_rthz, or −1.</summary>
    public int OmsT { get; } = -1;

    /// <summary>Index of foreground_amplitude_relative, or −1.</summary>
    public int Foreground { get; } = -1;

    /// <summary>Column names, in vector order.</summary>
    public string[] Names { get; }

    /// <summary>The sampler's schema.</summary>
    public ParameterSchema Schema { get; }

    /// <summary>Dimension d.</summary>
    public int Dimension => Names.Length;

    /// <summary>The starting point: multipliers 1 and the starting foreground amplitude.</summary>
    public double[] StartVector()
    {
        var start = new double[Dimension];
        Array.Fill(start, 1.0);
        if (Foreground >= 0) start[Foreground] = _settings.ForegroundAmplitude;
        return start;
    }

    /// <summary>PSD coefficients of the A/E group: squared multipliers and the foreground amplitude.</summary>
    public void AeCoefficients(ReadOnlySpan<double> theta, Span<double> coefficients)
    {
        coefficients[0] = theta[AccelerationAe] * theta[AccelerationAe];
        coefficients[1] = theta[OmsAe] * theta[OmsAe];
        if (Foreground >= 0) coefficients[2] = theta[Foreground];
    }

    /// <summary>PSD coefficients of the T group (only when T is fitted).</summary>
    public void TCoefficients(ReadOnlySpan<double> theta, Span<double> coefficients)
    {
        coefficients[0] = theta[AccelerationT] * theta[AccelerationT];
        coefficients[1] = theta[OmsT] * theta[OmsT];
    }

    /// <summary>The reported columns: ASDs in SI units and the foreground amplitude.</summary>
    public void ToReported(ReadOnlySpan<double> theta, Span<double> reported)
    {
        for (int i = 0; i < Dimension; i++) reported[i] = theta[i];
        reported[AccelerationAe] *= _settings.AccelerationAsd;
        reported[OmsAe] *= _settings.OmsAsd;
        if (AccelerationT >= 0)
        {
            reported[AccelerationT] *= _settings.AccelerationAsd;
            reported[OmsT] *= _settings.OmsAsd;
        }
    }

    /// <summary>The levels of a vector; unfitted ones at their starting values (foreground 0 when not modelled).</summary>
    public NoiseLevels ToLevels(ReadOnlySpan<double> theta) => new(
        theta[AccelerationAe] * _settings.AccelerationAsd,
        theta[OmsAe] * _settings.OmsAsd,
        AccelerationT >= 0 ? theta[AccelerationT] * _settings.AccelerationAsd : _settings.AccelerationAsd,
        OmsT >= 0 ? theta[OmsT] * _settings.OmsAsd : _settings.OmsAsd,
        Foreground >= 0 ? theta[Foreground] : 0.0);
}
