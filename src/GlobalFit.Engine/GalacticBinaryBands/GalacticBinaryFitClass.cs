using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.GalacticBinaries;

namespace GlobalFit.Engine.GalacticBinaryBands;

/// <summary>Registers the galactic binaries with the fit engine: one reversible-jump worker per band window, the even
/// and odd windows in two groups so that each group's templates never share a bin.</summary>
public sealed class GalacticBinaryFitClass : IFitSourceClass
{
    /// <summary>The class id and config section.</summary>
    public const string Id = "galactic_binaries";

    /// <inheritdoc />
    public string ClassId => Id;

    /// <inheritdoc />
    public IFitSourceClassPlan Plan(ConfigTable section, FitDataShape shape)
    {
        ArgumentNullException.ThrowIfNull(section);
        ArgumentNullException.ThrowIfNull(shape);
        var generator = CreateGenerator(shape);
        var (settings, plan) = GalacticBinaryBandSettings.FromConfig(section, generator);
        return new GalacticBinaryFitPlan(settings, plan, generator);
    }

    internal static GalacticBinaryTemplateGenerator CreateGenerator(FitDataShape shape) =>
        new(shape.DurationS, shape.CadenceS, startSeconds: shape.StartS);
}
