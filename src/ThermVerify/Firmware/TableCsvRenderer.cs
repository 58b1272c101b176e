using System.Globalization;
using System.Text;

namespace ThermVerify.Firmware;

/// <summary>
/// Renders a table as CSV, "code,temperature_celsius", one row per code of the span (the values the C routine
/// returns) or per breakpoint. Temperatures print with exactly the unit's digits, so reading them back is exact.
/// </summary>
public static class TableCsvRenderer
{
    public const string Header = "code,temperature_celsius";

    public static string Render(FirmwareTable table, bool breakpointsOnly = false)
    {
        ArgumentNullException.ThrowIfNull(table);
        var sb = new StringBuilder(Header).Append('\n');
        var codes = breakpointsOnly ? table.Codes : Enumerable.Range(table.Span.FirstCode, table.Span.Count).ToArray();
        foreach (var code in codes)
            sb.Append(code.ToString(CultureInfo.InvariantCulture)).Append(',').Append(table.Scale.FormatCelsius(table.Evaluate(code))).Append('\n');
        return sb.ToString();
    }
}
