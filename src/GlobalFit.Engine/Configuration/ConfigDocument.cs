using GlobalFit.Physics.Files;
using Tomlyn.Parsing;
using Tomlyn.Syntax;

namespace GlobalFit.Engine.Configuration;

/// <summary>Reads a TOML configuration file into a <see cref="ConfigTable"/> tree that remembers the line and
/// column of every key.</summary>
/// <remarks>Uses Tomlyn's syntax tree rather than its object serializer, because the serializer silently
/// ignores unknown keys and cannot report where a well-formed but invalid value stands.</remarks>
public static class ConfigDocument
{
    /// <summary>Parses the file at <paramref name="path"/>.</summary>
    /// <exception cref="InvalidInputException">The file is missing, unreadable or not valid TOML.</exception>
    public static ConfigTable Load(string path)
    {
        string text = TextFile.ReadUtf8(path);
        return Parse(text, path);
    }

    /// <summary>Parses TOML <paramref name="text"/>; <paramref name="sourceName"/> is used in error messages.</summary>
    /// <exception cref="InvalidInputException">The text is not valid TOML or uses an unsupported value type.</exception>
    public static ConfigTable Parse(string text, string sourceName)
    {
        DocumentSyntax document = SyntaxParser.Parse(text, sourceName, validate: true);
        foreach (var diagnostic in document.Diagnostics)
        {
            if (diagnostic.Kind != DiagnosticMessageKind.Error) continue;
            var start = diagnostic.Span.Start;
            throw new InvalidInputException(sourceName, $"line {start.Line + 1}, column {start.Column + 1}", diagnostic.Message);
        }
        var root = new ConfigTable(sourceName, "", 1, 1);
        foreach (var keyValue in document.KeyValues) AddKeyValue(root, keyValue, sourceName);
        foreach (var table in document.Tables)
        {
            var names = KeyParts(table.Name!);
            int line = table.Span.Start.Line + 1, column = table.Span.Start.Column + 1;
            ConfigTable target = table is TableArraySyntax
                ? AppendArrayTable(root, names, line, column, sourceName)
                : Navigate(root, names, line, column, sourceName);
            foreach (var keyValue in table.Items) AddKeyValue(target, keyValue, sourceName);
        }
        return root;
    }

    private static void AddKeyValue(ConfigTable table, KeyValueSyntax keyValue, string sourceName)
    {
        var parts = KeyParts(keyValue.Key!);
        int line = keyValue.Span.Start.Line + 1, column = keyValue.Span.Start.Column + 1;
        var owner = Navigate(table, parts.Take(parts.Count - 1).ToList(), line, column, sourceName);
        string path = Join(owner.Path, parts[^1]);
        object value = Convert(keyValue.Value!, path, sourceName);
        owner.Add(parts[^1], new ConfigValue(value, line, column), key => Duplicate(sourceName, line, column, Join(owner.Path, key)));
    }

    private static object Convert(ValueSyntax value, string path, string sourceName)
    {
        var start = value.Span.Start;
        switch (value)
        {
            case IntegerValueSyntax i: return i.Value;
            case FloatValueSyntax f: return f.Value;
            case BooleanValueSyntax b: return b.Value;
            case StringValueSyntax s: return s.Value ?? "";
            case ArraySyntax array:
                var items = new List<object>();
                foreach (var item in array.Items) items.Add(Convert(item.Value!, path, sourceName));
                return items;
            case InlineTableSyntax inline:
                var table = new ConfigTable(sourceName, path, start.Line + 1, start.Column + 1);
                foreach (var item in inline.Items) AddKeyValue(table, item.KeyValue!, sourceName);
                return table;
            default:
                throw new InvalidInputException(sourceName, $"line {start.Line + 1}, column {start.Column + 1}, key '{path}'",
                    "dates and times are not used in globalfit configurations; give times in seconds");
        }
    }

    private static ConfigTable Navigate(ConfigTable table, IReadOnlyList<string> parts, int line, int column, string sourceName)
    {
        foreach (var part in parts)
        {
            if (table.TryGetRaw(part, out var existing))
            {
                table = existing.Value switch
                {
                    ConfigTable t => t,
                    List<object> list when list.Count > 0 && list[^1] is ConfigTable last => last,
                    _ => throw Duplicate(sourceName, line, column, Join(table.Path, part)),
                };
                continue;
            }
            var child = new ConfigTable(sourceName, Join(table.Path, part), line, column);
            table.Add(part, new ConfigValue(child, line, column), key => Duplicate(sourceName, line, column, key));
            table = child;
        }
        return table;
    }

    private static ConfigTable AppendArrayTable(ConfigTable root, IReadOnlyList<string> names, int line, int column, string sourceName)
    {
        var parent = Navigate(root, names.Take(names.Count - 1).ToList(), line, column, sourceName);
        string name = names[^1];
        var element = new ConfigTable(sourceName, Join(parent.Path, name), line, column);
        if (parent.TryGetRaw(name, out var existing))
        {
            if (existing.Value is not List<object> list) throw Duplicate(sourceName, line, column, Join(parent.Path, name));
            list.Add(element);
        }
        else
        {
            parent.Add(name, new ConfigValue(new List<object> { element }, line, column), key => Duplicate(sourceName, line, column, key));
        }
        return element;
    }

    private static List<string> KeyParts(KeySyntax key)
    {
        var parts = new List<string> { KeyText(key.Key!) };
        foreach (var dotted in key.DotKeys) parts.Add(KeyText(dotted.Key!));
        return parts;
    }

    private static string KeyText(BareKeyOrStringValueSyntax key) => key switch
    {
        BareKeySyntax bare => bare.Key!.Text!,
        StringValueSyntax quoted => quoted.Value ?? "",
        _ => key.ToString()!.Trim(),
    };

    private static string Join(string path, string key) => path.Length == 0 ? key : $"{path}.{key}";

    private static InvalidInputException Duplicate(string sourceName, int line, int column, string key) =>
        new(sourceName, $"line {line}, column {column}, key '{key}'", $"'{key}' is defined more than once");
}
