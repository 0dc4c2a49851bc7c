using System.Collections.Immutable;

namespace GlobalFit.Engine.Fitting;

/// <summary>Builds the catalogue sources of one source class from the sample blocks its workers appended.</summary>
public interface IClassCatalogue
{
    /// <summary>Adds one worker's samples of one iteration.</summary>
    /// <param name="block">The block.</param>
    void Add(SampleBlock block);

    /// <summary>The sources so far, in a stable order.</summary>
    ImmutableArray<CatalogueRecord> Build();
}
