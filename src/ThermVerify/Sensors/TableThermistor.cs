namespace ThermVerify.Sensors;

/// <summary>One row of an R–T table.</summary>
public readonly record struct TablePoint(double Celsius, double Ohms);

/// <summary>
/// NTC thermistor from an R–T table, interpolated in ln R against 1/T with a monotone cubic.
/// The valid range is the table's span.
/// </summary>
public sealed class TableThermistor : ISensorModel
{
    /// <summary>Builds from points; throws <see cref="SensorTableException"/> naming offending rows.</summary>
    public static TableThermistor FromPoints(IReadOnlyList<TablePoint> points, string sourceName = "table")
        => throw new NotImplementedException();

    /// <summary>Reads a CSV of temperature (°C) and resistance (Ω); a header line is allowed.</summary>
    public static TableThermistor Load(string csvPath) => throw new NotImplementedException();

    public IReadOnlyList<TablePoint> Points => throw new NotImplementedException();
    public string Description => throw new NotImplementedException();
    public TemperatureRange ValidRange => throw new NotImplementedException();
    public double ResistanceOhms(double temperatureCelsius) => throw new NotImplementedException();
    public double TemperatureCelsius(double resistanceOhms) => throw new NotImplementedException();
    public double SlopeOhmsPerKelvin(double temperatureCelsius) => throw new NotImplementedException();
}

/// <summary>An R–T table that cannot be used: too short, non-monotone, unreadable. Names file and rows.</summary>
public sealed class SensorTableException(string message, string sourceName, int line) : Exception(message)
{
    public string SourceName { get; } = sourceName;
    /// <summary>1-based line of the first offending row, or 0 when the problem is the whole table.</summary>
    public int Line { get; } = line;
}
