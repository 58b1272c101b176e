using System.Globalization;
using static ThermVerify.Quantities.PhysicalConstants;

namespace ThermVerify.Sensors;

/// <summary>One row of an R–T table.</summary>
public readonly record struct TablePoint(double Celsius, double Ohms);

/// <summary>
/// NTC thermistor from an R–T table, interpolated in ln R against 1/T with a monotone cubic.
/// The valid range is the table's span.
/// </summary>
/// <remarks>
/// ln R against 1/T is nearly a straight line for an NTC (exactly one for a Beta model), so interpolating
/// there needs far fewer rows than interpolating R against T. The monotone cubic (Fritsch–Carlson 1980)
/// keeps one temperature per resistance, which an ordinary cubic spline does not promise.
/// </remarks>
internal sealed class TableThermistor : ISensorModel
{
    /// <summary>Fewest rows accepted: the end slopes of the cubic need three, and one spare catches a typo.</summary>
    public const int MinimumRows = 4;

    private readonly MonotoneCubic _lnROfInverseKelvin;
    private readonly string _sourceName;

    private TableThermistor(IReadOnlyList<TablePoint> points, string sourceName)
    {
        Points = points;
        _sourceName = sourceName;
        ValidRange = new TemperatureRange(points[0].Celsius, points[^1].Celsius);
        // Reversed so that both 1/T and ln R increase along the arrays.
        _lnROfInverseKelvin = new MonotoneCubic(
            [.. points.Reverse().Select(p => 1 / ToKelvin(p.Celsius))],
            [.. points.Reverse().Select(p => Math.Log(p.Ohms))]);
    }

    /// <summary>Builds from points; throws <see cref="SensorTableException"/> naming offending rows.</summary>
    /// <remarks>Rows are numbered from 1 in the order given.</remarks>
    public static TableThermistor FromPoints(IReadOnlyList<TablePoint> points, string sourceName = "table")
    {
        ArgumentNullException.ThrowIfNull(points);
        return FromRows([.. points.Select((p, i) => new TableRow(p, i + 1))], sourceName, "row");
    }

    /// <summary>Reads a CSV of temperature (°C) and resistance (Ω); a header line is allowed.</summary>
    /// <remarks>Comma or semicolon separates the two cells, '#' starts a comment, a decimal point is required.</remarks>
    public static TableThermistor Load(string csvPath)
    {
        string text;
        try
        {
            text = Files.InputFile.ReadText(csvPath, Limits.Work.Limits.MaximumFileBytes);
        }
        catch (Files.InputFileException e)
        {
            throw new SensorTableException($"Cannot read R–T table '{csvPath}': the file {e.Problem}. {e.Hint}", csvPath, 0);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new SensorTableException($"Cannot read R–T table '{csvPath}': {e.Message}", csvPath, 0);
        }
        return Parse(text, csvPath);
    }

    /// <summary>Parses CSV text as <see cref="Load"/> does; <paramref name="sourceName"/> appears in errors.</summary>
    public static TableThermistor Parse(string csvText, string sourceName) =>
        FromRows(RtTableCsv.Read(csvText, sourceName), sourceName, "line");

    public IReadOnlyList<TablePoint> Points { get; }

    /// <summary>The interpolant itself (ln R against 1/T), so a SPICE deck can carry the very same curve.</summary>
    internal MonotoneCubic LnResistanceOfInverseKelvin => _lnROfInverseKelvin;

    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"NTC R–T table '{_sourceName}' ({Points.Count} rows, monotone cubic in ln R against 1/T), valid {ValidRange}");

    public TemperatureRange ValidRange { get; }

    public double ResistanceOhms(double temperatureCelsius)
    {
        RangeGuard.CheckTemperature(temperatureCelsius, ValidRange, this);
        return Math.Exp(_lnROfInverseKelvin.Value(1 / ToKelvin(temperatureCelsius)));
    }

    public double TemperatureCelsius(double resistanceOhms)
    {
        RangeGuard.CheckResistance(resistanceOhms, Points[^1].Ohms, Points[0].Ohms, ValidRange, this);
        return ToCelsius(1 / _lnROfInverseKelvin.Inverse(Math.Log(resistanceOhms)));
    }

    public double SlopeOhmsPerKelvin(double temperatureCelsius)
    {
        var ohms = ResistanceOhms(temperatureCelsius);
        var kelvin = ToKelvin(temperatureCelsius);
        // R = exp(v(u)), u = 1/T: dR/dT = R · v'(u) · (−1/T²).
        return -ohms * _lnROfInverseKelvin.Derivative(1 / kelvin) / (kelvin * kelvin);
    }

    private static TableThermistor FromRows(IReadOnlyList<TableRow> rows, string sourceName, string rowWord)
    {
        RtTableRules.Check(rows, sourceName, rowWord);
        return new TableThermistor([.. rows.Select(r => r.Point)], sourceName);
    }
}

/// <summary>An R–T table that cannot be used: too short, non-monotone, unreadable. Names file and rows.</summary>
public sealed class SensorTableException(string message, string sourceName, int line) : Exception(message)
{
    public string SourceName { get; } = sourceName;
    /// <summary>1-based line of the first offending row, or 0 when the problem is the whole table.</summary>
    public int Line { get; } = line;
}
