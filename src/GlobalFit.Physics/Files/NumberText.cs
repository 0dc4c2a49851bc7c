using System.Globalization;

namespace GlobalFit.Physics.Files;

/// <summary>The one way numbers are written for people and CSV readers: invariant culture, a lower-case <c>e</c> and an
/// exponent of at least two digits with its sign (<c>7.43e-21</c>, <c>1e+20</c>), never the three-digit exponent of
/// .NET's <c>E</c> format (<c>7.430E-021</c>).</summary>
public static class NumberText
{
    /// <summary>The shortest text that reads back as the same double: <c>0.001</c>, <c>2e-22</c>, <c>NaN</c>.</summary>
    /// <param name="value">Any double.</param>
    /// <returns>The text.</returns>
    public static string RoundTrip(double value) => Lower(value.ToString("R", CultureInfo.InvariantCulture));

    /// <summary>At most <paramref name="digits"/> significant digits, in positional or exponent form, whichever is
    /// shorter (.NET's <c>G</c>): <c>7.43e-21</c>, <c>0.0123</c>.</summary>
    /// <param name="value">Any double.</param>
    /// <param name="digits">Significant digits, 1 to 17.</param>
    /// <returns>The text.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="digits"/> is outside 1–17.</exception>
    public static string Significant(double value, int digits)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(digits, 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(digits, 17);
        return Lower(value.ToString("G" + digits.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture));
    }

    /// <summary>Always in exponent form with <paramref name="decimals"/> digits after the point: <c>7.43e-21</c>,
    /// <c>1.00e+00</c>; <c>NaN</c> and infinities as .NET writes them.</summary>
    /// <param name="value">Any double.</param>
    /// <param name="decimals">Digits after the point, 0 to 16.</param>
    /// <returns>The text.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="decimals"/> is outside 0–16.</exception>
    public static string Scientific(double value, int decimals)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(decimals);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(decimals, 16);
        if (!double.IsFinite(value)) return value.ToString(CultureInfo.InvariantCulture);
        string format = (decimals == 0 ? "0" : "0." + new string('0', decimals)) + "e+00";
        return value.ToString(format, CultureInfo.InvariantCulture);
    }

    // .NET's R and G already write at least two exponent digits with a sign ("E-05", "E+20"); only the letter changes.
    private static string Lower(string text) => text.Replace('E', 'e');
}
