using System.Globalization;

namespace ThermVerify.Sensors;

/// <summary>What an NTC R–T table must satisfy before it is interpolated; every refusal names the rows.</summary>
internal static class RtTableRules
{
    public static void Check(IReadOnlyList<TableRow> rows, string source, string rowWord)
    {
        foreach (var row in rows)
        {
            var (t, r) = (row.Point.Celsius, row.Point.Ohms);
            if (!double.IsFinite(t) || t <= -Quantities.PhysicalConstants.ZeroCelsiusInKelvin)
                Fail(source, row.Line, $"{rowWord} {row.Line}: temperature {F(t)} °C is not a finite temperature above −273.15 °C.");
            if (!double.IsFinite(r) || r <= 0)
                Fail(source, row.Line, $"{rowWord} {row.Line}: resistance {F(r)} Ω at {F(t)} °C must be a positive finite number of ohms.");
        }
        if (rows.Count < TableThermistor.MinimumRows)
            Fail(source, 0, $"has {rows.Count} data rows; at least {TableThermistor.MinimumRows} are needed: add rows covering the temperatures of interest.");
        for (var i = 1; i < rows.Count; i++)
        {
            var (prev, row) = (rows[i - 1], rows[i]);
            if (row.Point.Celsius == prev.Point.Celsius)
                Fail(source, row.Line, $"{rowWord}s {prev.Line} and {row.Line} both give {F(row.Point.Celsius)} °C " +
                    $"({F(prev.Point.Ohms)} Ω and {F(row.Point.Ohms)} Ω); remove one of the duplicate temperatures.");
            if (row.Point.Celsius < prev.Point.Celsius)
                Fail(source, row.Line, $"{rowWord} {row.Line} ({F(row.Point.Celsius)} °C) comes after {rowWord} {prev.Line} " +
                    $"({F(prev.Point.Celsius)} °C); temperatures must be strictly increasing: sort the table.");
            if (row.Point.Ohms >= prev.Point.Ohms)
                Fail(source, row.Line, $"resistance does not fall with temperature: {rowWord} {prev.Line} has {F(prev.Point.Ohms)} Ω " +
                    $"at {F(prev.Point.Celsius)} °C, {rowWord} {row.Line} has {F(row.Point.Ohms)} Ω at {F(row.Point.Celsius)} °C; " +
                    "an NTC table must fall strictly (check for a typo or a swapped column).");
        }
    }

    private static string F(double v) => v.ToString("G8", CultureInfo.InvariantCulture);

    private static void Fail(string source, int line, string what) =>
        throw new SensorTableException($"R–T table '{source}': {what}", source, line);
}
