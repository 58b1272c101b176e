using System.Globalization;

namespace ThermVerify.Firmware;

/// <summary>One row of a firmware table as read: its 1-based line in the file, the code and the temperature in °C.</summary>
public readonly record struct TableRow(int Line, int Code, double Celsius);

/// <summary>A table file that cannot be read; names the source, the line and what would fix it.</summary>
public sealed class TableFormatException(string source, int line, string message)
    : FormatException($"{source}({line}): {message}")
{
    public string SourceName { get; } = source;
    public int Line { get; } = line;
}

/// <summary>
/// Reads "code,temperature" CSV: one header line allowed (its first field not a number), blank lines and lines
/// starting with '#' skipped. Temperatures are °C, or integers in a fixed-point unit when one is given.
/// Rows may come in any order (out-of-order rows are a finding of the verifier, not a read error); a code twice is an error.
/// </summary>
internal static class TableCsvReader
{
    public static IReadOnlyList<TableRow> Parse(string text, string sourceName, FixedPointScale? unit = null)
    {
        ArgumentNullException.ThrowIfNull(text);
        var rows = new List<TableRow>();
        var seen = new Dictionary<int, int>();
        var lines = text.Replace("\r\n", "\n").Split('\n');
        var headerAllowed = true;
        for (var i = 0; i < lines.Length; i++)
        {
            var line = i + 1;
            var content = lines[i].Trim();
            if (content.Length == 0 || content.StartsWith('#')) continue;
            var fields = content.Split(',');
            if (headerAllowed && !double.TryParse(fields[0], NumberStyles.Float, CultureInfo.InvariantCulture, out _))
            {
                headerAllowed = false;
                continue;
            }
            headerAllowed = false;
            if (fields.Length != 2)
                throw new TableFormatException(sourceName, line, $"expected 2 fields 'code,temperature', found {fields.Length}: '{content}'. Remove extra columns or use '.' as the decimal point.");
            var codeText = fields[0].Trim();
            if (!int.TryParse(codeText, NumberStyles.Integer, CultureInfo.InvariantCulture, out var code))
                throw new TableFormatException(sourceName, line, $"the code '{codeText}' is not a whole number.");
            var celsius = ReadTemperature(fields[1].Trim(), unit, sourceName, line);
            if (seen.TryGetValue(code, out var first))
                throw new TableFormatException(sourceName, line, $"code {code} appears again (first on line {first}); each code may have one temperature.");
            seen[code] = line;
            rows.Add(new TableRow(line, code, celsius));
        }
        if (rows.Count == 0)
            throw new TableFormatException(sourceName, lines.Length, "the file holds no rows of 'code,temperature'.");
        return rows;
    }

    private static double ReadTemperature(string text, FixedPointScale? unit, string source, int line)
    {
        if (unit is { } scale)
        {
            if (!int.TryParse(text, NumberStyles.Integer, CultureInfo.InvariantCulture, out var value))
                throw new TableFormatException(source, line, $"the temperature '{text}' is not a whole number in units of {scale.Name}; read the file in °C if it holds decimals.");
            return scale.ToCelsius(value);
        }
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var celsius) || !double.IsFinite(celsius))
            throw new TableFormatException(source, line, $"the temperature '{text}' is not a number in °C.");
        return celsius;
    }
}
