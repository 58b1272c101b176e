namespace ThermVerify.Sensors;

/// <summary>One row of a sensor's R(T) table: resistance, slope and the relative coefficient α = (dR/dT)/R.</summary>
internal readonly record struct SensorTableRow(double Celsius, double Ohms, double SlopeOhmsPerKelvin)
{
    public double AlphaPerKelvin => SlopeOhmsPerKelvin / Ohms;
}

/// <summary>Tabulates a sensor model over a range; the end of the range is always included.</summary>
internal static class SensorTabulation
{
    public static IReadOnlyList<SensorTableRow> Tabulate(ISensorModel sensor, TemperatureRange range, double stepKelvin)
    {
        if (!(stepKelvin > 0)) throw new ArgumentOutOfRangeException(nameof(stepKelvin), stepKelvin, "the step must be positive");
        var rows = new List<SensorTableRow>();
        foreach (var celsius in Grid(range, stepKelvin))
            rows.Add(new SensorTableRow(celsius, sensor.ResistanceOhms(celsius), sensor.SlopeOhmsPerKelvin(celsius)));
        return rows;
    }

    /// <summary>Min, min + step, … and max itself; points are computed from the index so no rounding accumulates.</summary>
    public static IEnumerable<double> Grid(TemperatureRange range, double stepKelvin)
    {
        var count = (int)Math.Floor((range.MaxCelsius - range.MinCelsius) / stepKelvin + 1e-9);
        for (var i = 0; i <= count; i++) yield return range.MinCelsius + i * stepKelvin;
        if (range.MinCelsius + count * stepKelvin < range.MaxCelsius - 1e-9) yield return range.MaxCelsius;
    }
}
