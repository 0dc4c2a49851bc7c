using System.Text;

namespace GlobalFit.Cli.Tests.Fuzzing;

/// <summary>Mutations of line-oriented text (TOML configurations, JSON-lines telemetry): values of the wrong type, empty
/// or absurd values, lost and repeated lines, cut files and bytes that are not UTF-8, mixed with plain byte damage.</summary>
internal static class TextMutations
{
    // Replacement values: the wrong type for every key (string, array, table, boolean), empty and blank strings, numbers
    // beyond every range (negative, zero, huge, not finite), and text that is not a value at all.
    private static readonly string[] Values =
    [
        "\"\"", "\"   \"", "\"x\"", "[]", "[1, 2]", "{}", "true", "false", "0", "-1", "1e308", "-1e308", "nan", "inf",
        "9223372036854775807", "99999999999999999999", "1e-320", "0.0", "\"/\"", "\"..\"", "\"/proc/self/mem\"", "=",
        "\"\\u0000\"", "2147483648", "4294967296", "1.5", "{ a = 1 }", "[[1], [\"a\"]]", "\"a\\\"b\"",
    ];

    /// <summary>One mutation of <paramref name="seed"/> (UTF-8 text); <paramref name="donor"/> supplies spliced lines.</summary>
    public static byte[] Mutate(byte[] seed, byte[] donor, Random random)
    {
        if (random.Next(4) == 0) return ByteMutations.Mutate(seed, donor, random);
        var lines = Encoding.UTF8.GetString(seed).Split('\n').ToList();
        if (lines.Count == 0) return ByteMutations.Mutate(seed, donor, random);
        int at = random.Next(lines.Count);
        switch (random.Next(6))
        {
            case 0:
            case 1:
                lines[at] = ReplaceValue(lines[at], random);
                break;
            case 2:
                lines.RemoveAt(at);
                break;
            case 3:
                lines.Insert(at, lines[random.Next(lines.Count)]);
                break;
            case 4:
                var donorLines = Encoding.UTF8.GetString(donor).Split('\n');
                lines.Insert(at, donorLines[random.Next(donorLines.Length)]);
                break;
            default:
                lines[at] = lines[at][..random.Next(lines[at].Length + 1)];
                break;
        }
        return Encoding.UTF8.GetBytes(string.Join('\n', lines));
    }

    private static string ReplaceValue(string line, Random random)
    {
        string value = Values[random.Next(Values.Length)];
        int equals = line.IndexOf('=', StringComparison.Ordinal);
        if (equals >= 0) return line[..(equals + 1)] + " " + value;
        int colon = line.IndexOf(':', StringComparison.Ordinal);
        if (colon >= 0)
        {
            // JSON: replace the value after a random key with a JSON value of another type.
            string[] json = ["null", "\"\"", "[]", "{}", "-1", "1e999", "\"x\"", "true", "18446744073709551616"];
            int comma = line.IndexOf(',', colon);
            string replacement = json[random.Next(json.Length)];
            return comma < 0 ? line[..(colon + 1)] + replacement + "}" : line[..(colon + 1)] + replacement + line[comma..];
        }
        return value;
    }
}
