namespace GlobalFit.Physics.MassiveBlackHoleBinaries;

/// <summary>The fits of the IMRPhenomD coefficients as polynomials in the symmetric mass ratio η and the reduced spin χ_PN.</summary>
/// <remarks>
/// <para>Khan et al. 2016 (arXiv:1508.07253), Table V and the mapping equation of its Sec. VI:
/// with <c>x = χ_PN − 1</c>,
/// <c>Λ = λ00 + λ10 η + x (λ01 + λ11 η + λ21 η²) + x² (λ02 + λ12 η + λ22 η²) + x³ (λ03 + λ13 η + λ23 η²)</c>.
/// The eleven numbers per row are given here in the order λ00, λ10, λ01, λ11, λ21, λ02, λ12, λ22, λ03, λ13, λ23.</para>
/// <para>Values from memory (six significant figures, the precision the paper prints), not checked against the
/// printed table. They are supported by an internal-consistency test: the connection coefficients β1 and α1
/// derived by C1 matching reproduce the separately fitted β1 and α1 to within a few M of time
/// (<c>PhenomDConsistencyTests</c>), which a wrong leading digit in any phase row would break.
/// The polynomial is evaluated at the un-normalised χ_PN (not χ_PN/(1 − 76η/113)): only then do the three separately
/// fitted phase pieces agree (derived: the same consistency test run with both spin variables).</para>
/// </remarks>
public static class PhenomDCoefficientTable
{
    private const int PerRow = 11;

    // Khan et al. 2016, Table V (from memory; see the type remarks).
    private static readonly double[] Lambda =
    [
        3931.9, -17395.8, 3132.38, 343966, -1.21626e+06, -70698, 1.38391e+06, -3.96628e+06, -60017.5, 803515, -2.09171e+06, // rho1
        -40105.5, 112253, 23561.7, -3.47618e+06, 1.13759e+07, 754313, -1.30848e+07, 3.64446e+07, 596227, -7.42779e+06, 1.8929e+07, // rho2
        83208.4, -191238, -210916, 8.71798e+06, -2.69149e+07, -1.98898e+06, 3.0888e+07, -8.39087e+07, -1.4535e+06, 1.70635e+07, -4.27487e+07, // rho3
        0.814984, 2.57476, 1.16102, -2.36278, 6.77104, 0.757078, -2.72569, 7.11404, 0.176693, -0.797869, 2.11624, // v2
        0.0069274, 0.0302047, 0.00630802, -0.120741, 0.262716, 0.00341518, -0.107793, 0.27099, 0.000737419, -0.0274962, 0.0733151, // gamma1
        1.01034, 0.000899312, 0.283949, -4.04975, 13.2078, 0.103963, -7.02506, 24.7849, 0.030932, -2.6924, 9.60937, // gamma2
        1.30816, -0.00553773, -0.0678292, -0.668983, 3.40315, -0.0529658, -0.992379, 4.82068, -0.00613414, -0.384293, 1.75618, // gamma3
        2096.55, 1463.75, 1312.55, 18307.3, -43534.1, -833.289, 32047.3, -108609, 452.251, 8353.44, -44531.3, // sigma1
        -10114.1, -44631, -6541.31, -266959, 686328, 3405.64, -437508, 1.63182e+06, -7462.65, -114585, 674402, // sigma2
        22933.7, 230960, 14961.1, 1.19402e+06, -3.10422e+06, -3038.17, 1.87203e+06, -7.30915e+06, 42738.2, 467502, -3.06485e+06, // sigma3
        -14621.7, -377813, -9608.68, -1.71089e+06, 4.33292e+06, -22366.7, -2.50197e+06, 1.02745e+07, -85360.3, -570025, 4.39684e+06, // sigma4
        97.8975, -42.6597, 153.484, -1417.06, 2752.86, 138.741, -1433.66, 2857.74, 41.0251, -423.681, 850.359, // beta1
        -3.2827, -9.05138, -12.4154, 55.4716, -106.051, -11.953, 76.807, -155.332, -3.41293, 25.5724, -54.408, // beta2
        -2.51564e-05, 1.97503e-05, -1.83707e-05, 2.18863e-05, 8.25024e-05, 7.15737e-06, -5.578e-05, 0.000191421, 5.44717e-06, -3.22061e-05, 7.97402e-05, // beta3
        43.3151, 638.633, -32.8577, 2415.89, -5766.88, -61.8546, 2953.97, -8986.29, -21.5714, 981.216, -3239.57, // alpha1
        -0.0702021, -0.162698, -0.187251, 1.13831, -2.83342, -0.17138, 1.71975, -4.53972, -0.0499834, 0.606207, -1.68277, // alpha2
        9.59881, -397.054, 16.2021, -1574.83, 3600.34, 27.0924, -1786.48, 5152.92, 11.1757, -577.8, 1808.73, // alpha3
        -0.0298949, 1.40221, -0.0735605, 0.833701, 0.224001, -0.0552029, 0.566719, 0.718693, -0.0155074, 0.157503, 0.210768, // alpha4
        0.997441, -0.00788445, -0.0590469, 1.39587, -4.51663, -0.0558534, 1.75166, -5.99021, -0.0179453, 0.59651, -2.06089, // alpha5
    ];

    /// <summary>Evaluates the fit of <paramref name="coefficient"/> at symmetric mass ratio <paramref name="eta"/> and
    /// reduced spin <paramref name="chiPn"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The coefficient is not one of the enumeration's values.</exception>
    public static double Evaluate(PhenomDCoefficient coefficient, double eta, double chiPn)
    {
        int row = (int)coefficient;
        if (row < 0 || row > (int)PhenomDCoefficient.Alpha5)
            throw new ArgumentOutOfRangeException(nameof(coefficient), coefficient, "unknown IMRPhenomD coefficient");
        var l = Lambda.AsSpan(row * PerRow, PerRow);
        double x = chiPn - 1.0;
        double eta2 = eta * eta;
        return l[0] + l[1] * eta
            + x * (l[2] + l[3] * eta + l[4] * eta2
            + x * (l[5] + l[6] * eta + l[7] * eta2
            + x * (l[8] + l[9] * eta + l[10] * eta2)));
    }
}
