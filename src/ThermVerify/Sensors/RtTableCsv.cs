using System.Globalization;

namespace ThermVerify.Sensors;

/// <summary>
/// Reads two-column CSV (temperature °C, resistance Ω). Only a decimal point is accepted, because a decimal
/// comma inside a comma-separated file cannot be told apart from a separator; refusing is safer than guessing.
/// </summary>
internal static class RtTableCsv
{
    public static IReadOnlyList<TableRow> Read(string text, string source)
    {
        var rows = new List<TableRow>();
        var lines = text.Split('\n');
        var headerAllowed = true;
        for (var i = 0; i < lines.Length; i++)
        {
            var lineNumber = i + 1;
            var content = lines[i];
            var hash = content.IndexOf('#');
            if (hash >= 0) content = content[..hash];
            content = content.Trim();
            if (content.Length == 0) continue;

            var cells = content.Split(content.Contains(';') ? ';' : ',').Select(c => c.Trim()).ToArray();
            if (cells.Length != 2)
                Fail(source, lineNumber, $"line {lineNumber} has {cells.Length} cells ('{content}'); " +
                    "expected two: temperature in °C and resistance in Ω, separated by a comma or a semicolon.");
            var hasT = TryNumber(cells[0], out var t);
            var hasR = TryNumber(cells[1], out var r);
            if (!hasT && !hasR && headerAllowed)
            {
                headerAllowed = false;
                continue;
            }
            headerAllowed = false;
            if (!hasT)
                Fail(source, lineNumber, $"line {lineNumber}: temperature cell '{cells[0]}' is not a number (use a decimal point, e.g. 25.5).");
            if (!hasR)
                Fail(source, lineNumber, $"line {lineNumber}: resistance cell '{cells[1]}' is not a number of ohms (use a decimal point, e.g. 10000 or 1.2e4).");
            rows.Add(new TableRow(new TablePoint(t, r), lineNumber));
        }
        return rows;
    }

    private static bool TryNumber(string cell, out double value) =>
        double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out value);

    private static void Fail(string source, int line, string what) =>
        throw new SensorTableException($"R–T table '{source}': {what}", source, line);
}
