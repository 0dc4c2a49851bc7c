namespace GlobalFit.Cli.Plotting;

/// <summary>Registers the font shipped with globalfit as ScottPlot's default.</summary>
/// <remarks>ScottPlot's Skia back end finds fonts by scanning the system font folder; on a machine with no
/// font packages it renders every label as nothing, without an error (observed with ScottPlot 5 on a machine without
/// font packages).
/// Registering a bundled DejaVu Sans (free licence, beside the file) makes labels appear everywhere.</remarks>
public static class PlotFonts
{
    private static readonly Lock Gate = new();
    private static bool _registered;

    /// <summary>Name under which the bundled font is registered.</summary>
    public const string FamilyName = "globalfit sans";

    /// <summary>Registers the bundled font once per process.</summary>
    /// <exception cref="FileNotFoundException">The font file is missing from the installation.</exception>
    public static void EnsureRegistered()
    {
        lock (Gate)
        {
            if (_registered) return;
            // Titles are drawn bold, so the bold face is registered too; without it Skia would fall back
            // to whatever the system has, which may be nothing.
            foreach (var (file, bold) in new[] { ("DejaVuSans.ttf", false), ("DejaVuSans-Bold.ttf", true) })
            {
                string path = Path.Combine(AppContext.BaseDirectory, "Fonts", file);
                if (!File.Exists(path))
                    throw new FileNotFoundException($"bundled plot font missing from the installation: {path}", path);
                ScottPlot.Fonts.AddFontFile(FamilyName, path, bold, italic: false);
            }
            ScottPlot.Fonts.Default = FamilyName;
            _registered = true;
        }
    }
}
