using System.Numerics;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.Tests.Fitting;

public sealed class ResidualBookTests
{
    private static readonly FitDataShape Shape = new("test", 256, 5.0, 0.0);

    [Fact]
    public void Residual_is_data_minus_every_other_template_exactly_whatever_the_order_of_replacement()
    {
        var data = RandomSpectra(Shape.BinCount, 1);
        var workers = new[] { ("w/a", new BinWindow(10, 40), true), ("w/b", new BinWindow(30, 40), true), ("w/c", new BinWindow(60, 30), false) };
        var templates = workers.ToDictionary(w => w.Item1, w => Template(w.Item2, w.Item3, w.Item1.GetHashCode(StringComparison.Ordinal)));

        // Two books receive the same final templates, one in forward and one in reverse order with intermediate values.
        var forward = Book(data, workers);
        foreach (var (id, _, _) in workers) forward.Replace(id, templates[id]);
        var backward = Book(data, workers);
        foreach (var (id, bins, t) in workers.Reverse())
        {
            backward.Replace(id, Template(bins, t, 99));
            backward.Replace(id, templates[id]);
        }

        foreach (var (id, bins, t) in workers)
        {
            var a = forward.ResidualFor(id);
            var b = backward.ResidualFor(id);
            Assert.Equal(a.Spectra.A, b.Spectra.A);
            Assert.Equal(a.Spectra.E, b.Spectra.E);
            // Exact: the same canonical sum, d − h_other1 − h_other2 in ordinal order, computed here independently.
            for (int k = 0; k < bins.Count; k++)
            {
                Complex expected = data.A[bins.First + k];
                foreach (var (other, otherBins, _) in workers.OrderBy(w => w.Item1, StringComparer.Ordinal))
                    if (other != id && otherBins.Contains(bins.First + k)) expected -= templates[other].A[bins.First + k - otherBins.First];
                Assert.Equal(expected, a.Spectra.A[k]);
            }
        }
    }

    [Fact]
    public void Noise_worker_residual_subtracts_every_template_and_leaves_t_of_a_worker_without_t_alone()
    {
        var data = RandomSpectra(Shape.BinCount, 2);
        var workers = new[] { ("w/a", new BinWindow(10, 40), true), ("w/c", new BinWindow(60, 30), false) };
        var ones = Enumerable.Repeat(1.0, Shape.BinCount).ToArray();
        var noise = new WorkerDescriptor("noise", new BinWindow(0, Shape.BinCount), "noise", true, WorkerRole.Noise);
        var book = new ResidualBook(data, [.. Descriptors(workers), noise], ones, ones, ones);
        var ta = Template(workers[0].Item2, true, 3);
        var tc = Template(workers[1].Item2, false, 4);
        book.Replace("w/a", ta);
        book.Replace("w/c", tc);
        var full = book.ResidualFor("noise").Spectra;
        Assert.Equal(data.A[5], full.A[5]);
        Assert.Equal(data.A[20] - ta.A[10], full.A[20]);
        Assert.Equal(data.E[70] - tc.E[10], full.E[70]);
        Assert.Equal(data.T[70], full.T![70]);
        Assert.Equal(data.T[20] - ta.T![10], full.T[20]);
    }

    [Fact]
    public void Residual_carries_the_inverse_psd_of_the_window()
    {
        var data = RandomSpectra(Shape.BinCount, 5);
        var book = Book(data, [("w/a", new BinWindow(10, 4), false)]);
        var inverse = Enumerable.Range(0, Shape.BinCount).Select(k => (double)k).ToArray();
        book.SetInversePsd(inverse, inverse, inverse);
        var residual = book.ResidualFor("w/a");
        Assert.Equal([10.0, 11.0, 12.0, 13.0], residual.InverseA);
        Assert.Null(residual.Spectra.T);
        Assert.Null(residual.InverseT);
    }

    [Fact]
    public void A_template_over_other_bins_is_refused()
    {
        var book = Book(RandomSpectra(Shape.BinCount, 6), [("w/a", new BinWindow(10, 4), false)]);
        var error = Assert.Throws<ArgumentException>(() => book.Replace("w/a", WindowSpectra.Zero(new BinWindow(11, 4), false)));
        Assert.Contains("w/a", error.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => book.Replace("w/a", WindowSpectra.Zero(new BinWindow(10, 4), true)));
    }

    [Fact]
    public void A_noise_worker_holds_no_template()
    {
        var noise = new WorkerDescriptor("noise", new BinWindow(0, 16), "noise", false, WorkerRole.Noise);
        var ones = Enumerable.Repeat(1.0, Shape.BinCount).ToArray();
        var book = new ResidualBook(RandomSpectra(Shape.BinCount, 8), [noise], ones, ones, ones);
        var error = Assert.Throws<ArgumentException>(() => book.Replace("noise", WindowSpectra.Zero(new BinWindow(0, 16), false)));
        Assert.Contains("noise", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_worker_window_outside_the_data_is_refused()
    {
        var error = Assert.Throws<ArgumentException>(() => Book(RandomSpectra(Shape.BinCount, 7), [("w/a", new BinWindow(120, 20), false)]));
        Assert.Contains("outside", error.Message, StringComparison.Ordinal);
    }

    private static ResidualBook Book(FitData data, IEnumerable<(string, BinWindow, bool)> workers)
    {
        var ones = Enumerable.Repeat(1.0, Shape.BinCount).ToArray();
        return new ResidualBook(data, Descriptors(workers), ones, ones, ones);
    }

    private static IEnumerable<WorkerDescriptor> Descriptors(IEnumerable<(string Id, BinWindow Bins, bool IncludesT)> workers) =>
        workers.Select(w => new WorkerDescriptor(w.Id, w.Bins, w.Id, w.IncludesT));

    private static FitData RandomSpectra(int bins, int seed)
    {
        var random = new Random(seed);
        Complex[] Channel() => [.. Enumerable.Range(0, bins).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5))];
        return FitData.FromSpectra(Shape, Channel(), Channel(), Channel());
    }

    private static WindowSpectra Template(BinWindow bins, bool includeT, int seed)
    {
        var random = new Random(seed);
        Complex[] Channel() => [.. Enumerable.Range(0, bins.Count).Select(_ => new Complex(random.NextDouble(), random.NextDouble()))];
        return new WindowSpectra(bins, Channel(), Channel(), includeT ? Channel() : null);
    }
}
