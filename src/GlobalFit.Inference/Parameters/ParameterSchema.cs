using System.Collections.Immutable;

namespace GlobalFit.Inference.Parameters;

/// <summary>The ordered list of parameters of a model (or of one source in a transdimensional model).</summary>
/// <remarks>
/// <para>Boundary handling is applied by the samplers after a proposal fills its candidate. Wrapping and
/// reflection are the images of a translation-invariant kernel under the quotient and mirror maps, so a
/// symmetric proposal stays symmetric; proposals that return a non-zero log ratio must therefore produce
/// in-range candidates themselves (the prior-draw proposal does).</para>
/// <para>Immutable and thread-safe.</para>
/// </remarks>
public sealed class ParameterSchema
{
    private readonly double[] _lower;
    private readonly double[] _upper;
    private readonly BoundaryKind[] _boundaries;

    /// <summary>Creates a schema from parameter specs, validating each.</summary>
    /// <param name="parameters">The parameters in vector order; at least one.</param>
    /// <exception cref="ArgumentException">No parameters, duplicated names, or an invalid spec.</exception>
    public ParameterSchema(IEnumerable<ParameterSpec> parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        Parameters = [.. parameters];
        if (Parameters.Length == 0)
        {
            throw new ArgumentException("A schema needs at least one parameter.", nameof(parameters));
        }

        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (ParameterSpec spec in Parameters)
        {
            spec.Validate();
            if (!names.Add(spec.Name))
            {
                throw new ArgumentException($"Parameter name '{spec.Name}' appears twice.", nameof(parameters));
            }
        }

        _lower = new double[Parameters.Length];
        _upper = new double[Parameters.Length];
        _boundaries = new BoundaryKind[Parameters.Length];
        for (int i = 0; i < Parameters.Length; i++)
        {
            _lower[i] = Parameters[i].Lower;
            _upper[i] = Parameters[i].Upper;
            _boundaries[i] = Parameters[i].Boundary;
        }
    }

    /// <summary>The parameters in vector order.</summary>
    public ImmutableArray<ParameterSpec> Parameters { get; }

    /// <summary>Number of parameters.</summary>
    public int Dimension => _lower.Length;

    /// <summary>
    /// Maps <paramref name="values"/> into the support in place: periodic values wrap, reflecting values are
    /// mirrored (repeatedly if needed).
    /// </summary>
    /// <param name="values">A candidate vector of length <see cref="Dimension"/>.</param>
    /// <returns><c>false</c> if a <see cref="BoundaryKind.Reject"/> parameter is out of range or a value is not
    /// finite, in which case the candidate must be rejected.</returns>
    public bool TryApplyBoundaries(Span<double> values)
    {
        for (int i = 0; i < _lower.Length; i++)
        {
            double value = values[i];
            if (!double.IsFinite(value))
            {
                return false;
            }

            double lower = _lower[i];
            double upper = _upper[i];
            if (value >= lower && value <= upper)
            {
                continue;
            }

            switch (_boundaries[i])
            {
                case BoundaryKind.Periodic:
                    values[i] = Wrap(value, lower, upper);
                    break;
                case BoundaryKind.Reflect:
                    values[i] = Reflect(value, lower, upper);
                    break;
                default:
                    return false;
            }
        }

        return true;
    }

    /// <summary>Whether every value lies inside its parameter's [lower, upper] range.</summary>
    /// <param name="values">A vector of length <see cref="Dimension"/>.</param>
    /// <returns><c>true</c> if all values are finite and in range.</returns>
    public bool Contains(ReadOnlySpan<double> values)
    {
        for (int i = 0; i < _lower.Length; i++)
        {
            if (!(values[i] >= _lower[i] && values[i] <= _upper[i]))
            {
                return false;
            }
        }

        return true;
    }

    /// <summary>Wraps <paramref name="value"/> into [lower, upper).</summary>
    /// <param name="value">The value.</param>
    /// <param name="lower">Range start.</param>
    /// <param name="upper">Range end (identified with <paramref name="lower"/>).</param>
    /// <returns>The wrapped value.</returns>
    public static double Wrap(double value, double lower, double upper)
    {
        double width = upper - lower;
        double offset = (value - lower) % width;
        if (offset < 0.0)
        {
            offset += width;
        }

        double wrapped = lower + offset;
        // Rounding of lower + offset can land exactly on upper; upper is the same point as lower.
        return wrapped >= upper ? lower : wrapped;
    }

    /// <summary>Mirrors <paramref name="value"/> at the edges until it lies in [lower, upper].</summary>
    /// <param name="value">The value.</param>
    /// <param name="lower">Range start.</param>
    /// <param name="upper">Range end.</param>
    /// <returns>The reflected value.</returns>
    public static double Reflect(double value, double lower, double upper)
    {
        // Reflection at both walls is wrapping with period 2·width followed by folding the second half.
        double width = upper - lower;
        double offset = (value - lower) % (2.0 * width);
        if (offset < 0.0)
        {
            offset += 2.0 * width;
        }

        double reflected = offset <= width ? lower + offset : upper - (offset - width);
        return Math.Clamp(reflected, lower, upper);
    }
}
