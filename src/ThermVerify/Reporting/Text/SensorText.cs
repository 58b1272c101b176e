using System.Text;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>What `sensor` prints: the model, R(T) with slope and α over a range, and T at asked resistances.</summary>
internal static class SensorText
{
    public static string Render(ISensorModel model, TemperatureRange range, double stepKelvin, IReadOnlyList<double> resistancesOhms)
    {
        var text = new StringBuilder();
        text.AppendLine(model.Description);
        text.AppendLine($"valid range: {model.ValidRange}");
        text.AppendLine();
        var table = new TextTable("T (°C)", "R", "dR/dT (Ω/K)", "α (%/K)");
        foreach (var row in SensorTabulation.Tabulate(model, range, stepKelvin))
            table.AddRow(Format(row.Celsius, "0.##"), EngineeringFormat.Format(row.Ohms, UnitKind.Ohm, 5),
                Format(row.SlopeOhmsPerKelvin, "G5"), Format(100 * row.AlphaPerKelvin, "0.0000"));
        text.Append(table);
        if (resistancesOhms.Count == 0) return text.ToString();

        text.AppendLine();
        var inverse = new TextTable("R", "T (°C)");
        foreach (var ohms in resistancesOhms)
            inverse.AddRow(EngineeringFormat.Format(ohms, UnitKind.Ohm, 5), Format(model.TemperatureCelsius(ohms), "0.0000"));
        text.Append(inverse);
        return text.ToString();
    }
}
