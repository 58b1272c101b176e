using System.Text;

namespace ThermVerify.Reporting.Text;

/// <summary>A plain-text table for terminals and logs: right-aligned numbers, left-aligned text.</summary>
internal sealed class TextTable(params string[] headers)
{
    private readonly List<string[]> _rows = [];

    public TextTable AddRow(params string[] cells)
    {
        if (cells.Length != headers.Length)
            throw new ArgumentException($"row has {cells.Length} cells, the table has {headers.Length} columns");
        _rows.Add(cells);
        return this;
    }

    public override string ToString()
    {
        var widths = headers.Select((h, i) => _rows.Select(r => r[i].Length).Prepend(h.Length).Max()).ToArray();
        var text = new StringBuilder();
        AppendLine(text, headers, widths);
        text.AppendLine(string.Join("  ", widths.Select(w => new string('-', w))));
        foreach (var row in _rows) AppendLine(text, row, widths);
        return text.ToString();
    }

    private static void AppendLine(StringBuilder text, string[] cells, int[] widths)
    {
        var padded = cells.Select((c, i) => LooksNumeric(c) ? c.PadLeft(widths[i]) : c.PadRight(widths[i]));
        text.AppendLine(string.Join("  ", padded).TrimEnd());
    }

    internal static bool LooksNumeric(string cell) =>
        cell.Length > 0 && (char.IsDigit(cell[0]) || ((cell[0] == '-' || cell[0] == '+' || cell[0] == '−') && cell.Length > 1 && char.IsDigit(cell[1])));
}
