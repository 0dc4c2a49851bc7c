using GlobalFit.Engine.Tests.Catalogue;

using GlobalFit.Tests.Shared;

namespace GlobalFit.Engine.Tests.Runs;

/// <summary>The loud-binaries record, simulated once for all end-to-end fit tests.</summary>
public sealed class SharedFitData : IDisposable
{
    private readonly TemporaryRunFolder _folder = new();

    public SharedFitData()
    {
        DataPath = _folder.File("loud.h5");
        FitRunFixture.Simulate(SmallFitRecord.Scenario, DataPath);
    }

    public string DataPath { get; }

    public void Dispose() => _folder.Dispose();
}
