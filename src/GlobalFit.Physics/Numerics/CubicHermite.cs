namespace GlobalFit.Physics.Numerics;

/// <summary>Cubic Hermite interpolation between two points with known values and first derivatives.</summary>
/// <remarks>The cubic matching <c>y0, y0'</c> at <c>t0</c> and <c>y1, y1'</c> at <c>t1</c> (e.g. Hairer, Nørsett &amp;
/// Wanner, Solving Ordinary Differential Equations I, 2nd ed. 1993, §II.6; section from memory). Its error is
/// <c>h⁴ max|y⁗|/384</c> over a step of length h, so with the derivatives an integrator already has at its step
/// points it gives a C¹ piecewise-cubic interpolant of fourth order without solving any system.</remarks>
public static class CubicHermite
{
    /// <summary>Value of the cubic at <paramref name="time"/>.</summary>
    public static double Value(double t0, double y0, double d0, double t1, double y1, double d1, double time)
    {
        double h = t1 - t0;
        double s = (time - t0) / h;
        double s2 = s * s, s3 = s2 * s;
        double h00 = 2 * s3 - 3 * s2 + 1;
        double h10 = s3 - 2 * s2 + s;
        double h01 = -2 * s3 + 3 * s2;
        double h11 = s3 - s2;
        return h00 * y0 + h10 * h * d0 + h01 * y1 + h11 * h * d1;
    }

    /// <summary>First derivative of the cubic at <paramref name="time"/>.</summary>
    public static double Derivative(double t0, double y0, double d0, double t1, double y1, double d1, double time)
    {
        double h = t1 - t0;
        double s = (time - t0) / h;
        double s2 = s * s;
        double g00 = 6 * s2 - 6 * s;
        double g10 = 3 * s2 - 4 * s + 1;
        double g01 = -6 * s2 + 6 * s;
        double g11 = 3 * s2 - 2 * s;
        return (g00 * y0 + g01 * y1) / h + g10 * d0 + g11 * d1;
    }
}
