using System.Collections.Immutable;

namespace GlobalFit.Engine.Fitting;

/// <summary>Workers of one class whose templates never share a bin, so they may update in the same stage.</summary>
/// <param name="Name">Schedule name, <c>class_id.group</c> (or the class id for a single group).</param>
/// <param name="Workers">Its workers.</param>
public sealed record WorkerGroup(string Name, ImmutableArray<WorkerDescriptor> Workers);
