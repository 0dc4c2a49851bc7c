namespace GlobalFit.Physics.Tests.Noise;

/// <summary>Test-only standard-normal draws: Box–Muller over <see cref="Random"/> with a fixed seed.</summary>
internal static class StandardNormals
{
    public static double[] Draw(int seed, int count)
    {
        var random = new Random(seed);
        var normals = new double[count];
        for (int i = 0; i < count; i += 2)
        {
            double u1 = 1.0 - random.NextDouble(); // in (0, 1], so the logarithm is finite
            double u2 = random.NextDouble();
            double radius = Math.Sqrt(-2.0 * Math.Log(u1));
            normals[i] = radius * Math.Cos(2.0 * Math.PI * u2);
            if (i + 1 < count) normals[i + 1] = radius * Math.Sin(2.0 * Math.PI * u2);
        }
        return normals;
    }
}
