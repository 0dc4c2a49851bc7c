using GlobalFit.Engine.Configuration;

namespace GlobalFit.Engine.Fitting;

/// <summary>The registration of one source class with the fit engine: the seam through which galactic binaries,
/// black-hole binaries and inspirals plug in. The engine and the CLI never switch on the class.</summary>
public interface IFitSourceClass
{
    /// <summary>Its id and config section name (e.g. <c>galactic_binaries</c>).</summary>
    string ClassId { get; }

    /// <summary>Reads and validates the class's section against the data record and plans its workers.</summary>
    /// <param name="section">The <c>[class_id]</c> table of the run configuration.</param>
    /// <param name="shape">The data record.</param>
    /// <returns>The plan.</returns>
    /// <exception cref="Physics.Input.InvalidInputException">A key is malformed or cannot work with the data; the
    /// message names it.</exception>
    IFitSourceClassPlan Plan(ConfigTable section, FitDataShape shape);
}
