using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

public class TableThermistorTests
{
    private static readonly TablePoint[] Good = [new(0, 32_000), new(25, 10_000), new(50, 3_600), new(75, 1_500), new(100, 680)];

    [Fact]
    public void Table_from_a_Beta_model_interpolates_back_exactly_between_rows()
    {
        // A Beta model is a straight line in ln R against 1/T (its definition), which a cubic Hermite
        // reproduces exactly; tolerance 1e-9 K covers rounding only.
        var beta = TestSensors.Beta10k();
        var table = TableThermistor.FromPoints(TestSensors.Rows(beta, 10));
        for (var t = -40.0; t <= table.ValidRange.MaxCelsius; t += 0.37)
            Tolerance.AssertClose(t, table.TemperatureCelsius(beta.ResistanceOhms(t)), rel: 0, abs: 1e-9, what: $"T at {t} °C");
    }

    [Fact]
    public void Table_from_a_curved_model_interpolates_within_a_millikelvin()
    {
        // Reference: the Steinhart–Hart model the 5 °C rows were taken from. Third-order interpolation on rows
        // 5 K apart leaves well under 1 mK here (measured about 1e-5 K); 1 mK is the stated tolerance.
        var sh = TestSensors.SteinhartHart();
        var table = TableThermistor.FromPoints(TestSensors.Rows(sh, 5));
        for (var t = -40.0; t <= table.ValidRange.MaxCelsius; t += 0.23)
            Tolerance.AssertClose(t, table.TemperatureCelsius(sh.ResistanceOhms(t)), rel: 0, abs: 1e-3, what: $"T at {t} °C");
    }

    [Fact]
    public void Monotone_cubic_keeps_output_monotone_on_awkward_rows()
    {
        // Fritsch & Carlson (1980): with the α² + β² ≤ 9 limit the interpolant is monotone. Rows with a sharp
        // change of slope would overshoot with an unconstrained cubic.
        var table = TableThermistor.FromPoints([new(0, 50_000), new(1, 49_999), new(2, 10_000), new(3, 9_999), new(30, 9_000)]);
        var previous = double.PositiveInfinity;
        for (var t = 0.0; t <= 30; t += 0.01)
        {
            var r = table.ResistanceOhms(t);
            Assert.True(r <= previous, $"R rose from {previous} Ω to {r} Ω at {t} °C");
            Assert.True(table.SlopeOhmsPerKelvin(t) <= 0, $"slope positive at {t} °C");
            previous = r;
        }
    }

    [Fact]
    public void Valid_range_is_the_table_span_exactly()
    {
        var table = TableThermistor.FromPoints(Good);
        Assert.Equal(new TemperatureRange(0, 100), table.ValidRange);
        Assert.Equal(32_000, table.ResistanceOhms(0), 9);
        Assert.Throws<SensorRangeException>(() => table.ResistanceOhms(100.001));
        var e = Assert.Throws<SensorRangeException>(() => table.TemperatureCelsius(33_000));
        Assert.Contains("680 Ω to 32 kΩ", e.Message);
    }

    [Fact]
    public void Too_few_rows_are_refused()
    {
        var e = Assert.Throws<SensorTableException>(() => TableThermistor.FromPoints(Good[..3]));
        Assert.Contains("3 data rows", e.Message);
        Assert.Equal(0, e.Line);
    }

    [Fact]
    public void Duplicate_temperature_names_both_rows()
    {
        var e = Assert.Throws<SensorTableException>(() => TableThermistor.FromPoints([Good[0], Good[1], new(25, 9_000), Good[3]]));
        Assert.Contains("rows 2 and 3 both give 25 °C", e.Message);
        Assert.Equal(3, e.Line);
    }

    [Fact]
    public void Unsorted_temperatures_name_the_rows()
    {
        var e = Assert.Throws<SensorTableException>(() => TableThermistor.FromPoints([Good[0], Good[2], Good[1], Good[3]]));
        Assert.Contains("row 3 (25 °C) comes after row 2 (50 °C)", e.Message);
        Assert.Equal(3, e.Line);
    }

    [Fact]
    public void Rising_resistance_names_the_rows_and_values()
    {
        var e = Assert.Throws<SensorTableException>(() => TableThermistor.FromPoints([Good[0], Good[1], new(50, 11_000), Good[3]]));
        Assert.Contains("row 2 has 10000 Ω at 25 °C, row 3 has 11000 Ω at 50 °C", e.Message);
        Assert.Equal(3, e.Line);
    }

    [Fact]
    public void Csv_with_header_comments_and_semicolons_loads_and_errors_name_file_lines()
    {
        const string csv = "# invented sensor\ntemperature_C;resistance_ohm\n0;32000\n25;10000 # nominal\n\n50;3600\n75;1500\n";
        var table = TableThermistor.Parse(csv, "ntc.csv");
        Assert.Equal(4, table.Points.Count);
        Assert.Contains("ntc.csv", table.Description);

        var negative = Assert.Throws<SensorTableException>(() => TableThermistor.Parse(csv.Replace("50;3600", "50;-3600"), "ntc.csv"));
        Assert.Equal(6, negative.Line);
        Assert.Contains("line 6", negative.Message);
        Assert.Contains("-3600", negative.Message);

        var text = Assert.Throws<SensorTableException>(() => TableThermistor.Parse(csv.Replace("75;1500", "75;1k5"), "ntc.csv"));
        Assert.Equal(7, text.Line);
        Assert.Contains("'1k5'", text.Message);
        Assert.Equal("ntc.csv", text.SourceName);

        var comma = Assert.Throws<SensorTableException>(() => TableThermistor.Parse("t,R\n0,32000\n25,10000,5\n50,3600\n75,1500", "x.csv"));
        Assert.Equal(3, comma.Line);
        Assert.Contains("3 cells", comma.Message);
    }

    [Fact]
    public void Load_reads_a_file_and_names_a_missing_one()
    {
        var path = Path.Combine(Path.GetTempPath(), $"thermverify-table-{Guid.NewGuid():N}.csv");
        File.WriteAllText(path, "0,32000\n25,10000\n50,3600\n75,1500\n");
        try
        {
            Assert.Equal(new TemperatureRange(0, 75), TableThermistor.Load(path).ValidRange);
        }
        finally
        {
            File.Delete(path);
        }
        var e = Assert.Throws<SensorTableException>(() => TableThermistor.Load(path));
        Assert.Contains(path, e.Message);
    }
}
