namespace GlobalFit.Engine.Configuration;

/// <summary>A value read from a configuration file together with where it stands in that file.</summary>
/// <param name="Value">A <see cref="double"/>, <see cref="long"/>, <see cref="bool"/>, <see cref="string"/>,
/// <see cref="ConfigTable"/> or a list of these.</param>
/// <param name="Line">1-based line of the key.</param>
/// <param name="Column">1-based column of the key.</param>
public sealed record ConfigValue(object Value, int Line, int Column);
