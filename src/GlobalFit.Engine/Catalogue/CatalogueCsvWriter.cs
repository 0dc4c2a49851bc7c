using System.Globalization;
using System.Text;
using GlobalFit.Engine.Fitting;
using GlobalFit.Physics.Files;

namespace GlobalFit.Engine.Catalogue;

/// <summary>Writes catalogue records as one CSV table (<c>RUN/catalogue.csv</c>; columns in Catalogue/LAYOUT.md).</summary>
/// <remarks>One file for all classes with a <c>class</c> column, rather than a file per class: one file is what a run
/// leaves and what a spreadsheet opens. Parameter columns are the union of the classes' parameters in
/// order of first appearance; a cell is empty where a class has no such parameter.</remarks>
public static class CatalogueCsvWriter
{
    /// <summary>Suffix of the column holding a parameter's 5 % quantile.</summary>
    public const string LowerSuffix = "_lo";

    /// <summary>Suffix of the column holding a parameter's 95 % quantile.</summary>
    public const string UpperSuffix = "_hi";

    /// <summary>Suffix of the column holding a parameter's split R̂.</summary>
    public const string RhatSuffix = "_rhat";

    /// <summary>Suffix of the column holding a parameter's bulk effective sample size.</summary>
    public const string EssSuffix = "_ess";

    /// <summary>Prefix of the columns holding the fractions of a source's samples in each sky mode.</summary>
    public const string ModePrefix = "sky_";

    /// <summary>Writes <paramref name="records"/> to <paramref name="path"/>, atomically.</summary>
    /// <param name="path">Destination.</param>
    /// <param name="records">The sources, written in this order.</param>
    /// <param name="overwrite">Replace an existing file.</param>
    /// <exception cref="InvalidInputException">The file exists and <paramref name="overwrite"/> is false, or cannot be written.</exception>
    /// <exception cref="ArgumentException">A record is inconsistent.</exception>
    public static void Write(string path, IReadOnlyList<CatalogueRecord> records, bool overwrite)
    {
        CatalogueRecordChecks.Require(records);
        byte[] bytes = Encoding.UTF8.GetBytes(Format(records));
        AtomicFile.Write(path, overwrite, stream => stream.Write(bytes));
    }

    /// <summary>The CSV text of <paramref name="records"/>: a header line, then one line per record, lines ending in LF.</summary>
    /// <param name="records">The sources.</param>
    /// <returns>The text.</returns>
    public static string Format(IReadOnlyList<CatalogueRecord> records)
    {
        CatalogueRecordChecks.Require(records);
        var parameters = records.SelectMany(r => r.ParameterNames).Distinct(StringComparer.Ordinal).ToList();
        var text = new StringBuilder();
        var header = new List<string> { "id", "class", "confidence", "snr" };
        foreach (string name in parameters) header.AddRange([name, name + LowerSuffix, name + UpperSuffix]);
        // Convergence columns only when some record reports it, so a catalogue without (noise only) keeps its old shape.
        bool convergence = records.Any(r => r.Convergence is not null);
        var modes = records.Where(r => r.Convergence is not null).SelectMany(r => r.Convergence!.ModeNames).Distinct(StringComparer.Ordinal).ToList();
        if (convergence)
        {
            foreach (string name in parameters) header.AddRange([name + RhatSuffix, name + EssSuffix]);
            header.AddRange(modes.Select(m => ModePrefix + m));
        }
        text.AppendJoin(',', header.Select(Quote)).Append('\n');
        foreach (var r in records)
        {
            var cells = new List<string> { Quote(r.Id), Quote(r.ClassId), Number(r.Confidence), Number(r.Snr) };
            foreach (string name in parameters)
            {
                int c = r.ParameterNames.IndexOf(name);
                cells.AddRange(c < 0 ? ["", "", ""] : [Number(r.Median[c]), Number(r.Lower[c]), Number(r.Upper[c])]);
            }
            if (convergence)
            {
                var report = r.Convergence;
                foreach (string name in parameters)
                {
                    int c = r.ParameterNames.IndexOf(name);
                    cells.AddRange(c < 0 || report is null ? ["", ""] : [Number(report.SplitRhat[c]), Number(report.EffectiveSampleSize[c])]);
                }
                foreach (string mode in modes)
                {
                    int m = report is null ? -1 : report.ModeNames.IndexOf(mode);
                    cells.Add(m < 0 ? "" : Number(report!.ModeFractions[m]));
                }
            }
            text.AppendJoin(',', cells).Append('\n');
        }
        return text.ToString();
    }

    // Round-trip formatting (reading the file back gives the same doubles) with two-digit exponents: 7.43e-21.
    private static string Number(double value) => NumberText.RoundTrip(value);

    private static string Quote(string field) =>
        field.AsSpan().IndexOfAny(",\"\n\r") < 0 ? field : "\"" + field.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
}
