using System.Globalization;
using System.Text.RegularExpressions;
using ThermVerify.Quantities;
using Tomlyn;
using Tomlyn.Model;
using Tomlyn.Parsing;
using Tomlyn.Serialization;

namespace ThermVerify.Design;

/// <summary>
/// One TOML table of a design file with the positions of its keys. Tomlyn ignores nothing here because
/// every section declares its keys (<see cref="AllowOnly"/>) and every read reports errors at the value.
/// </summary>
internal sealed partial class TomlSection
{
    private readonly Context _context;
    private readonly TomlTable _table;
    private readonly SourcePosition _header;

    private TomlSection(Context context, TomlTable table, string path, SourcePosition header)
    {
        _context = context;
        _table = table;
        Path = path;
        _header = header;
    }

    /// <summary>Dotted path of this table ("" for the document, "check.region[2]" for a table-array entry).</summary>
    public string Path { get; }

    public string SourceName => _context.SourceName;

    public string BaseDirectory => _context.BaseDirectory;

    /// <summary>The files this design has read so far (beyond the design file itself), in order, for its digest.</summary>
    public IReadOnlyList<Provenance.SourceFile> FilesRead => _context.FilesRead;

    private sealed record Context(string SourceName, string Text, string BaseDirectory, TomlMetadataStore Store)
    {
        public List<Provenance.SourceFile> FilesRead { get; } = [];
    }

    /// <summary>Notes a file the design read (by its path relative to the design's folder), once, for the design's digest.</summary>
    public void NoteFileRead(string relative, string sha256)
    {
        if (_context.FilesRead.All(f => f.Name != relative)) _context.FilesRead.Add(new Provenance.SourceFile(relative, sha256));
    }

    /// <summary>Parses the whole document; syntax errors and duplicate keys become <see cref="DesignException"/>.</summary>
    public static TomlSection Open(string text, string sourceName, string baseDirectory)
    {
        TomlBounds.Check(text, sourceName);
        try
        {
            // The syntax parser with validation rejects duplicate keys, which the model deserialiser lets through.
            SyntaxParser.ParseStrict(text, sourceName, true);
            var store = new TomlMetadataStore();
            var table = TomlSerializer.Deserialize<TomlTable>(text, new TomlSerializerOptions { SourceName = sourceName, MetadataStore = store })
                ?? new TomlTable();
            return new TomlSection(new Context(sourceName, text, baseDirectory, store), table, "", SourcePosition.Start);
        }
        catch (TomlException e)
        {
            var message = DiagnosticPrefix().Replace(e.Message.Split('\n')[0].Trim(), "");
            throw new DesignException(sourceName, e.Line ?? 1, e.Column ?? 1, "", $"TOML syntax: {Printable(message.Replace('\u2424', ' '))}",
                "Fix the TOML at this position: strings in double quotes, one key = value per line, [section] headers.");
        }
        catch (Exception e) when (e is ArgumentException or InvalidOperationException or FormatException or OverflowException
                                      or IndexOutOfRangeException or NullReferenceException or InvalidCastException or NotSupportedException)
        {
            // The TOML library failed on its own (an unterminated string ending in a backslash): the text is still not usable TOML.
            throw new DesignException(sourceName, 1, 1, "", $"TOML syntax: the TOML reader could not read this file ({Printable(e.Message.Split('\n')[0].TrimEnd('.'))})",
                "Look for an unclosed string (a line ending in a backslash inside quotes), a stray quote or an invalid escape.");
        }
    }

    /// <summary>The text with control and direction-override characters shown as U+XXXX, so no message carries them raw.</summary>
    public static string Printable(string text)
    {
        if (FirstUnprintable(text) < 0) return text;
        var builder = new System.Text.StringBuilder(text.Length + 16);
        foreach (var c in text)
            builder.Append(IsUnprintable(c) ? $"U+{(int)c:X4}" : c.ToString());
        return builder.ToString();
    }

    /// <summary>
    /// A key as a message shows it: printable, and cut to its first <see cref="ShownKeyCharacters"/> characters with
    /// its length stated when longer, so a mistyped or hostile key of a megabyte does not fill the terminal.
    /// </summary>
    public static string Shown(string key) => Printable(key.Length <= ShownKeyCharacters + 16
        ? key
        : string.Create(CultureInfo.InvariantCulture, $"{key[..ShownKeyCharacters]}… ({key.Length:N0} characters)"));

    private const int ShownKeyCharacters = 48;

    /// <summary>The index of the first control character (C0, DEL, C1) or bidirectional override in <paramref name="text"/>, or −1.</summary>
    public static int FirstUnprintable(string text)
    {
        for (var i = 0; i < text.Length; i++)
            if (IsUnprintable(text[i])) return i;
        return -1;
    }

    private static bool IsUnprintable(char c) => char.IsControl(c) || c is >= '\u202A' and <= '\u202E' or >= '\u2066' and <= '\u2069';

    [GeneratedRegex(@"^.*?\(\d+,\d+\)\s*:\s*error\s*:\s*")]
    private static partial Regex DiagnosticPrefix();

    public bool Has(string key) => _table.ContainsKey(key);

    public string KeyPath(string key) => Path.Length == 0 ? key : $"{Path}.{key}";

    /// <summary>Rejects keys outside <paramref name="valid"/>, naming the nearest valid one.</summary>
    /// <param name="elsewhere">Optional explanation for a key that is valid in another context (e.g. another sensor model).</param>
    public void AllowOnly(IReadOnlyCollection<string> valid, Func<string, string?>? elsewhere = null)
    {
        foreach (var key in _table.Keys)
        {
            if (valid.Contains(key))
                continue;
            var explanation = elsewhere?.Invoke(key);
            if (explanation is not null)
                throw ErrorAtKey(key, $"unexpected key \"{Shown(key)}\"", explanation);
            var near = KeySuggestion.Nearest(key, valid);
            var list = string.Join(", ", valid);
            var hint = near is null ? $"Valid keys here: {list}." : $"Did you mean \"{near}\"? Valid keys here: {list}.";
            throw ErrorAtKey(key, $"unknown key \"{Shown(key)}\"", hint);
        }
    }

    public DesignException ErrorAtKey(string key, string problem, string hint)
    {
        var at = KeyPosition(key);
        return new DesignException(SourceName, at.Line, at.Column, Shown(KeyPath(key)), problem, hint);
    }

    public DesignException ErrorAtValue(string key, string problem, string hint)
    {
        var at = ValuePosition(key);
        return new DesignException(SourceName, at.Line, at.Column, Shown(KeyPath(key)), problem, hint);
    }

    public DesignException Missing(string key, string hint)
    {
        var where = Path.Length == 0 ? "the file" : $"[{Path}]";
        return new DesignException(SourceName, _header.Line, _header.Column, KeyPath(key), $"missing required key \"{key}\" in {where}", hint);
    }

    private SourcePosition KeyPosition(string key)
    {
        if (_context.Store.TryGetProperties(_table, out var metadata) && metadata is not null
            && metadata.TryGetProperty(key, out var property) && property is not null)
            return SourcePosition.At(_context.Text, property.Span.Start.Offset);
        return _header;
    }

    /// <summary>Where the value of <paramref name="key"/> starts: past the key, the '=' and blanks.</summary>
    private SourcePosition ValuePosition(string key)
    {
        if (!(_context.Store.TryGetProperties(_table, out var metadata) && metadata is not null
            && metadata.TryGetProperty(key, out var property) && property is not null))
            return _header;
        var text = _context.Text;
        var i = property.Span.End.Offset + 1;
        while (i < text.Length && text[i] is not ('=' or '\n'))
            i++;
        if (i < text.Length && text[i] == '=')
        {
            i++;
            while (i < text.Length && text[i] is ' ' or '\t')
                i++;
            return SourcePosition.At(text, i);
        }
        return SourcePosition.At(text, property.Span.Start.Offset);
    }

    public TomlSection? Section(string key)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        if (value is not TomlTable table)
            throw ErrorAtKey(key, $"\"{key}\" must be a section", $"Write it as a [{KeyPath(key)}] header followed by its keys.");
        return new TomlSection(_context, table, KeyPath(key), KeyPosition(key));
    }

    public TomlSection RequiredSection(string key, string hint) =>
        Section(key) ?? throw new DesignException(SourceName, _header.Line, _header.Column, KeyPath(key),
            $"missing section [{KeyPath(key)}]", hint);

    /// <summary>Entries of an array of tables ([[key]]); empty when absent.</summary>
    public IReadOnlyList<TomlSection> Sections(string key)
    {
        if (!_table.TryGetValue(key, out var value))
            return [];
        if (value is not TomlTableArray array)
            throw ErrorAtKey(key, $"\"{key}\" must be a list of sections", $"Write each entry under its own [[{KeyPath(key)}]] header.");
        var header = KeyPosition(key);
        return array.Select((t, i) => new TomlSection(_context, t, $"{KeyPath(key)}[{i + 1}]", FirstKeyPosition(t, header))).ToList();
    }

    private SourcePosition FirstKeyPosition(TomlTable table, SourcePosition fallback)
    {
        if (table.Count == 0 || !_context.Store.TryGetProperties(table, out var metadata) || metadata is null)
            return fallback;
        return metadata.TryGetProperty(table.Keys.First(), out var p) && p is not null
            ? SourcePosition.At(_context.Text, p.Span.Start.Offset)
            : fallback;
    }

    public string? String(string key)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        return Text(key, value as string ?? throw ErrorAtValue(key, $"\"{key}\" must be a string", $"Put the value in double quotes: {key} = \"...\"."));
    }

    /// <summary>
    /// Every text of a design is refused when it holds a control character or a direction override: an escape code in
    /// a name would reach the terminal, a report or a SPICE deck, and no design needs one.
    /// </summary>
    private string Text(string key, string text)
    {
        var at = FirstUnprintable(text);
        if (at < 0) return text;
        throw ErrorAtValue(key, $"the text holds the control character U+{(int)text[at]:X4} at position {at + 1}",
            "Remove it: names, descriptions, paths and values are plain printable text.");
    }

    public string RequiredString(string key, string hint) => String(key) ?? throw Missing(key, hint);

    /// <summary>One of a fixed set of words.</summary>
    public T? Choice<T>(string key, IReadOnlyDictionary<string, T> words) where T : struct =>
        ChoiceText(key, words.Keys) is { } text ? words[text] : null;

    public string? ChoiceText(string key, IEnumerable<string> words)
    {
        var text = String(key);
        if (text is null)
            return null;
        var list = words.ToList();
        if (list.Contains(text))
            return text;
        var near = KeySuggestion.Nearest(text, list);
        var quoted = string.Join(", ", list.Select(w => $"\"{w}\""));
        throw ErrorAtValue(key, $"\"{text}\" is not one of {quoted}", near is null ? $"Write one of {quoted}." : $"Did you mean \"{near}\"?");
    }

    /// <summary>A plain TOML number (integer or float); a string holding a plain number is accepted too.</summary>
    public double? Number(string key)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        switch (value)
        {
            case long l:
                return CheckPlausible(key, l, UnitKind.Dimensionless);
            case double d when double.IsFinite(d):
                return CheckPlausible(key, d, UnitKind.Dimensionless);
            case double:
                throw ErrorAtValue(key, "NaN and infinity are not values", "Write a finite number.");
            case string s:
                try
                {
                    return CheckPlausible(key, QuantityParser.Parse(Text(key, s), UnitKind.Dimensionless).Value, UnitKind.Dimensionless);
                }
                catch (QuantityFormatException e)
                {
                    throw ErrorAtValue(key, $"\"{s}\": {e.Problem}", $"Write a plain number, e.g. {key} = 1.5e-3.");
                }
            default:
                throw ErrorAtValue(key, $"\"{key}\" must be a number", $"Write e.g. {key} = 1.5e-3.");
        }
    }

    public long? Integer(string key)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        return value as long? ?? throw ErrorAtValue(key, $"\"{key}\" must be a whole number", $"Write e.g. {key} = 12 (no quotes, no decimal point).");
    }

    /// <summary>A value with a unit, written as a TOML string ("4k7", "3.3 V").</summary>
    public Quantity? Quantity(string key, Bound bound, params UnitKind[] kinds)
    {
        if (!_table.TryGetValue(key, out var value))
            return null;
        if (value is long or double)
        {
            var number = Convert.ToDouble(value, CultureInfo.InvariantCulture);
            if (!double.IsFinite(number))
                throw ErrorAtValue(key, "NaN and infinity are not values", "Write a finite number.");
            if (kinds.Contains(UnitKind.Dimensionless))
                return CheckBound(key, new Quantity(number, UnitKind.Dimensionless), bound);
            throw ErrorAtValue(key, "missing unit", $"Write the value with its unit as a string, e.g. {key} = \"{number.ToString(CultureInfo.InvariantCulture)} {ExampleUnit(kinds[0])}\".");
        }
        if (value is not string text)
            throw ErrorAtValue(key, $"\"{key}\" must be a value with a unit in double quotes", $"Write e.g. {key} = \"{ExampleUnit(kinds[0])}\".");
        try
        {
            return CheckBound(key, QuantityParser.Parse(Text(key, text), kinds), bound);
        }
        catch (QuantityFormatException e)
        {
            throw ErrorAtValue(key, $"\"{text}\": {e.Problem}", e.Hint);
        }
    }

    private Quantity CheckBound(string key, Quantity q, Bound bound)
    {
        if (bound == Bound.Positive && !(q.Value > 0))
            throw ErrorAtValue(key, $"must be greater than zero, got {EngineeringFormat.Format(q.Value, q.Unit)}", "Give a positive value.");
        if (bound == Bound.NonNegative && q.Value < 0)
            throw ErrorAtValue(key, $"cannot be negative, got {EngineeringFormat.Format(q.Value, q.Unit)}", "Give zero or a positive value.");
        CheckPlausible(key, q.Value, q.Unit);
        return q;
    }

    private double CheckPlausible(string key, double value, UnitKind kind)
    {
        if (Plausibility.Judge(KeyPath(key), value, kind) is { } refusal)
            throw ErrorAtValue(key, refusal.Problem, refusal.Hint);
        return value;
    }

    public double RequiredValue(string key, Bound bound, string hint, params UnitKind[] kinds) =>
        Quantity(key, bound, kinds)?.Value ?? throw Missing(key, hint);

    public double ValueOr(string key, double fallback, Bound bound, params UnitKind[] kinds) =>
        Quantity(key, bound, kinds)?.Value ?? fallback;

    public QuantityRange? Range(string key, params UnitKind[] kinds)
    {
        var text = String(key);
        if (text is null)
            return null;
        QuantityRange range;
        try
        {
            range = QuantityParser.ParseRange(text, kinds);
        }
        catch (QuantityFormatException e)
        {
            throw ErrorAtValue(key, $"\"{text}\": {e.Problem}", e.Hint);
        }
        CheckPlausible(key, range.Min, range.Unit);
        CheckPlausible(key, range.Max, range.Unit);
        return range;
    }

    /// <summary>The file a key names, resolved inside the design's folder and read once: its real path and its text.</summary>
    public (string FullPath, string Text) ReadFile(string key, string relative)
    {
        var (fullPath, content) = DesignPaths.Read(this, key, relative);
        NoteFileRead(relative, content.Sha256);
        return (fullPath, content.Text);
    }

    private static string ExampleUnit(UnitKind kind) => kind switch
    {
        UnitKind.Ohm => "ohm",
        UnitKind.Celsius => "degC",
        UnitKind.VoltPerSecond => "V/us",
        UnitKind.VoltPerRootHertz => "nV/rtHz",
        UnitKind.AmperePerRootHertz => "pA/rtHz",
        UnitKind.Degree => "deg",
        _ => UnitSymbols.PrintedSymbol(kind),
    };
}
