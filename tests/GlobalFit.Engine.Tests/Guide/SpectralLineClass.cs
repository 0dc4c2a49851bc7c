using System.Collections.Immutable;
using System.Numerics;
using GlobalFit.Engine.Benchmarking;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Engine.Simulation;
using GlobalFit.Engine.SourceClasses;
using GlobalFit.Inference.Parameters;
using GlobalFit.Inference.Random;
using GlobalFit.Inference.State;
using GlobalFit.Inference.Targets;
using GlobalFit.Inference.Tempering;
using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Noise;
using GlobalFit.Physics.Series;
using MessagePack;

namespace GlobalFit.Engine.Tests.Guide;

// The worked example of DEVELOPERS.md "Adding a source class", kept compiling and correct here; the text between the
// markers must appear verbatim in the guide (checked by AddSourceClassExampleTests).
// --- example start ---
// A toy class: "spectral lines", each a constant complex amplitude c (seconds, the unit of a Fourier amplitude) in
// one frequency bin of A and E. Scenario: [[spectral_lines.line]] id, bin, re_s, im_s. Fit: [spectral_lines]
// first_bin, count, spacing_bins: one worker per bin, all in one group since no two share a bin.
public sealed class SpectralLineClass : ISourceClass
{
    public const string Id = "spectral_lines";

    string ISourceClass.Id => Id;

    public bool RunsWithoutSection => false;

    public ImmutableArray<string> ParameterColumns { get; } = ["bin", "re_s", "im_s"];

    public ISimulatedSourceClass? Simulation { get; } = new LineSimulation();

    public IReadOnlyList<QuickBenchSuite> BenchSuites => [];

    public IDemoPart? Demo => null;

    public IFitSourceClassPlan PlanFit(ConfigTable section, FitDataShape shape)
    {
        int first = (int)section.GetInteger("first_bin", 1, 1, int.MaxValue);
        int count = (int)section.GetInteger("count", 1, 1, 1000);
        int spacing = (int)section.GetInteger("spacing_bins", 1, 1, int.MaxValue);
        int steps = (int)section.GetInteger("steps_per_update", 200, 1, 1_000_000);
        section.RejectUnknownKeys(["first_bin", "count", "spacing_bins", "steps_per_update"]);
        if (first + (long)(count - 1) * spacing >= shape.BinCount)
            throw section.Invalid("count", $"the last line's bin lies beyond the record's {shape.BinCount - 1}");
        return new LinePlan(first, count, spacing, steps);
    }

    private sealed class LineSimulation : ISimulatedSourceClass
    {
        public ISourceInjection ReadScenario(ConfigTable section, ObservationSettings observation)
        {
            var lines = section.GetTableArray("line").Select(t => (Id: t.GetString("id", ""), Bin: (int)t.GetInteger("bin", 0, 1, int.MaxValue),
                Value: new Complex(t.GetDouble("re_s", 0), t.GetDouble("im_s", 0)))).ToList();
            section.RejectUnknownKeys(["line"]);
            return new LineInjection(lines);
        }
    }

    private sealed class LineInjection(List<(string Id, int Bin, Complex Value)> lines) : ISourceInjection
    {
        public string ClassId => Id;

        public string ToToml() => string.Concat(lines.Select(l =>
            $"[[{Id}.line]]\nid = \"{l.Id}\"\nbin = {l.Bin}\nre_s = {TomlText.Number(l.Value.Real)}\nim_s = {TomlText.Number(l.Value.Imaginary)}\n\n"));

        public TruthTable Inject(InjectionContext context, Complex[] a, Complex[] e, Complex[] t)
        {
            double df = 1.0 / (context.Observation.SampleCount * context.Observation.CadenceS);
            var values = new List<double>();
            foreach (var (_, bin, value) in lines)
            {
                a[bin] += value;
                e[bin] += value;
                double f = bin * df;
                double snr2 = 4 * df * value.Magnitude * value.Magnitude
                    * (1 / context.Noise.Psd(AetChannel.A, f) + 1 / context.Noise.Psd(AetChannel.E, f));
                values.AddRange([bin, value.Real, value.Imaginary, Math.Sqrt(snr2)]);
            }
            return new TruthTable(Id, ["bin", "re_s", "im_s", "snr"], lines.Select(l => l.Id), [.. values]);
        }
    }

    private sealed class LinePlan(int first, int count, int spacing, int steps) : IFitSourceClassPlan
    {

        public string ClassId => Id;

        public IReadOnlyList<WorkerGroup> Groups { get; } =
            [new WorkerGroup(Id, [.. Enumerable.Range(0, count).Select(i => first + i * spacing)
                .Select(b => new WorkerDescriptor($"{Id}/{b}", new BinWindow(b, 1), $"bin {b}", false))])];

        public int StepsPerUpdate => steps;

        public IFitWorker CreateWorker(string workerId, ulong runSeed) => new LineWorker(workerId, Bin(workerId), runSeed, null);

        public IFitWorker RestoreWorker(string workerId, ReadOnlyMemory<byte> state)
        {
            var saved = MessagePackSerializer.Deserialize<LineWorkerState>(state);
            return new LineWorker(workerId, Bin(workerId), saved.Seed, saved.Sampler is null ? null : saved);
        }

        public IClassCatalogue CreateCatalogue(IPsdSource noise, long burnInIterations, double minimumConfidence) => new LineCatalogue(burnInIterations);

        public void WriteResolved(ResolvedConfigWriter writer)
        {
            writer.Key("first_bin", first);
            writer.Key("count", count);
            writer.Key("spacing_bins", spacing);
            writer.Key("steps_per_update", steps);
        }

        private static int Bin(string workerId) => int.Parse(workerId[(Id.Length + 1)..], System.Globalization.CultureInfo.InvariantCulture);
    }

    // The sampler works in units of the noise level: c = s (x + i y) with s = 1/√(4 Δf (1/S_A + 1/S_E)), fixed at the
    // first update and saved, so ln L(x, y) = −½ |(x, y) − (x̂, ŷ)|² + const and every proposal sees unit widths.
    [MessagePackObject]
    public sealed record LineWorkerState([property: Key(0)] ulong Seed, [property: Key(1)] double ScaleS, [property: Key(2)] byte[]? Sampler);

    // ln L = −½ (d − c | d − c) over the one bin, A and E; uniform prior on |x|, |y| ≤ 10⁴ (any line below SNR 10⁴).
    public sealed class LineModel(Complex a, Complex e, double weightA, double weightE, double df, double scale) : ITargetModel
    {
        public ParameterSchema Schema { get; } = new(
        [
            new ParameterSpec("x", "", -1e4, 1e4, BoundaryKind.Reflect),
            new ParameterSpec("y", "", -1e4, 1e4, BoundaryKind.Reflect),
        ]);

        public double LogPrior(ReadOnlySpan<double> theta) => -2 * Math.Log(2e4);

        public void DrawFromPrior(Span<double> theta, ref RandomStream random)
        {
            theta[0] = random.NextUniform(-1e4, 1e4);
            theta[1] = random.NextUniform(-1e4, 1e4);
        }

        public double LogLikelihood(ReadOnlySpan<double> theta)
        {
            var c = scale * new Complex(theta[0], theta[1]);
            double ra = (a - c).Magnitude, re = (e - c).Magnitude;
            return -2 * df * (weightA * ra * ra + weightE * re * re);
        }

        // The maximum-likelihood point, where a fresh sampler starts.
        public double[] Peak()
        {
            var c = (weightA * a + weightE * e) / (weightA + weightE) / scale;
            return [c.Real, c.Imaginary];
        }
    }

    private sealed class LineWorker(string id, int bin, ulong seed, LineWorkerState? saved) : IFitWorker
    {
        private LineWorkerState? _saved = saved;
        private Complex _current;

        public string Id => id;

        public BinWindow Bins => new(bin, 1);

        public bool IncludesT => false;

        public WorkerUpdate Update(WorkerResidual residual, int steps)
        {
            var (wA, wE, df) = (residual.InverseA[0], residual.InverseE[0], residual.DfHz);
            double scale = _saved?.ScaleS ?? 1 / Math.Sqrt(4 * df * (wA + wE));
            var model = new LineModel(residual.Spectra.A[0], residual.Spectra.E[0], wA, wE, df, scale);
            var settings = new ParallelTemperingSettings { Tempering = new TemperingSettings { TemperatureCount = 1 }, Seed = seed, StreamId = (ulong)bin };
            ParallelTemperingSampler<LineModel> pt;
            if (_saved?.Sampler is { } bytes)
            {
                // The residual changed since the last update (the other workers moved): re-score every chain first.
                var state = SamplerStateSerializer.DeserializeParallelTempering(bytes);
                state = state with { LogLikelihoods = [.. Enumerable.Range(0, state.LogLikelihoods.Length).Select(c => model.LogLikelihood(state.Positions.AsSpan(2 * c, 2)))] };
                pt = ParallelTemperingSampler<LineModel>.Resume(model, settings, state);
            }
            else
            {
                pt = new ParallelTemperingSampler<LineModel>(model, settings);
                for (int c = 0; c < pt.ChainCount; c++) pt.SetPosition(c, model.Peak());
            }
            var values = new List<double>();
            var logLikelihoods = new List<double>();
            for (int s = 0; s < steps; s++)
            {
                pt.Advance(1);
                values.AddRange([bin, scale * pt.Position(0)[0], scale * pt.Position(0)[1]]);
                logLikelihoods.Add(pt.LogLikelihood(0));
            }
            _saved = new LineWorkerState(seed, scale, SamplerStateSerializer.Serialize(pt.CaptureState()));
            _current = scale * new Complex(pt.Position(0)[0], pt.Position(0)[1]);
            var block = new SampleBlock(id, SpectralLineClass.Id, 0, ["bin", "re_s", "im_s"], [.. Enumerable.Repeat(1, steps)], [.. values], [.. logLikelihoods]);
            return new WorkerUpdate(CurrentTemplate(), block, new WorkerStatistics(steps, pt.Step, 1, logLikelihoods[^1], 0, TimeSpan.Zero));
        }

        public WindowSpectra? CurrentTemplate() => new(Bins, [_current], [_current], null);

        public byte[] SaveState() => MessagePackSerializer.Serialize(_saved ?? new LineWorkerState(seed, 0, null));

        public IReadOnlyList<Handover> TakeHandovers() => [];

        public void Accept(IReadOnlyList<Handover> handovers) { }
    }

    // One row per bin: medians and 5–95 % quantiles of the samples after burn-in.
    private sealed class LineCatalogue(long burnIn) : IClassCatalogue
    {
        private readonly SortedDictionary<string, List<double[]>> _rows = new(StringComparer.Ordinal);

        public void Add(SampleBlock block)
        {
            if (block.Iteration <= burnIn) return;
            if (!_rows.TryGetValue(block.WorkerId, out var rows)) _rows[block.WorkerId] = rows = [];
            for (int i = 0; i < block.SampleCount; i++) rows.Add(block.Values[(3 * i)..(3 * i + 3)]);
        }

        public ImmutableArray<CatalogueRecord> Build() =>
        [
            .. _rows.Select((w, index) =>
            {
                double Quantile(int column, double q) => w.Value.Select(r => r[column]).Order().ElementAt((int)(q * (w.Value.Count - 1)));
                ImmutableArray<double> At(double q) => [Quantile(0, q), Quantile(1, q), Quantile(2, q)];
                return new CatalogueRecord($"line-{index + 1:D4}", Id, 1.0, double.NaN, ["bin", "re_s", "im_s"],
                    At(0.5), At(0.05), At(0.95), [.. w.Value.SelectMany(r => r)]);
            }),
        ];
    }
}
// --- example end ---
