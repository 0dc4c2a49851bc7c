namespace GlobalFit.Inference.Tests.Support;

/// <summary>The check shared by the reversible-jump tests: the sampled posterior over the number of bumps, and the mean
/// amplitudes at each well-populated k, against the closed form of <see cref="LinearBumpsModel"/> (MacKay 2003, ch. 28).</summary>
internal static class ClosedFormPosterior
{
    /// <summary>Asserts each p(k | y) and, where p(k | y) ≥ 0.15, E[a | k] and E[b | k] within 4.5 ESS-based standard
    /// errors (false-failure rate 6.8e-6 per assertion).</summary>
    public static void AssertSampled(LinearBumpsModel model, CountSink sink)
    {
        (double[] expected, double[][] amplitudeMeans) = model.ClosedForm();
        int[] counts = sink.Counts.ToArray();
        Console.WriteLine("p(k|y) closed form: " + string.Join(", ", expected.Select(p => p.ToString("F4"))));
        Console.WriteLine("p(k|y) sampled:     " + string.Join(", ", Enumerable.Range(0, 5).Select(k => (counts.Count(c => c == k) / (double)counts.Length).ToString("F4"))));
        for (int k = 0; k <= 4; k++)
        {
            int kk = k;
            double[][] indicator = [counts.Select(c => c == kk ? 1.0 : 0.0).ToArray()];
            MonteCarloBounds.AssertMeanWithin(indicator, expected[k], 4.5, $"p(k={k})");
        }

        for (int k = 1; k <= 4; k++)
        {
            if (expected[k] < 0.15) continue;
            MonteCarloBounds.AssertMeanWithin([sink.MeanA[k].ToArray()], amplitudeMeans[k][0], 4.5, $"E[a | k={k}]");
            MonteCarloBounds.AssertMeanWithin([sink.MeanB[k].ToArray()], amplitudeMeans[k][1], 4.5, $"E[b | k={k}]");
        }
    }
}
