using GlobalFit.Engine.Catalogue;
using GlobalFit.Engine.Runs;
using GlobalFit.Engine.Samples;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>The noise worker's stored samples of a run, by parameter.</summary>
internal static class NoiseSamples
{
    public static Dictionary<string, List<double>> After(RunFolderLayout layout, long burnIn)
    {
        var columns = new Dictionary<string, List<double>>(StringComparer.Ordinal);
        foreach (var block in new SampleStore(layout.Root).Read("noise"))
        {
            if (block.Iteration <= burnIn) continue;
            int width = block.ParameterNames.Length;
            for (int s = 0; s < block.SampleCount; s++)
                for (int c = 0; c < width; c++)
                {
                    if (!columns.TryGetValue(block.ParameterNames[c], out var list)) columns[block.ParameterNames[c]] = list = [];
                    list.Add(block.Values[s * width + c]);
                }
        }
        return columns;
    }

    public static void AssertWithin(Dictionary<string, List<double>> samples, string name, double truth)
    {
        var values = samples[name];
        double mean = values.Average();
        double sd = Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / Math.Max(1, values.Count - 1));
        double sigma = Math.Max(sd, 0.005 * truth);
        Assert.True(Math.Abs(mean - truth) < 3 * sigma, $"{name}: posterior mean {mean:R} ± {sd:R} vs injected {truth:R}");
    }
}
