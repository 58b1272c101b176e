using ThermVerify.Design;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

public class TableBuilderTests
{
    [Theory]
    [InlineData(0.01, SensorSide.Low)]
    [InlineData(0.05, SensorSide.Low)]
    [InlineData(0.25, SensorSide.Low)]
    [InlineData(0.02, SensorSide.High)]
    [InlineData(0.1, SensorSide.High)]
    public void Breakpoint_tables_keep_the_bound_at_every_code(double boundKelvin, SensorSide side)
    {
        var model = FirmwareTestModels.NtcLowSide(side);
        var table = TableBuilder.WithinBound(model, FixedPointScale.CentiKelvin, boundKelvin);
        // Every code of the span, not only the breakpoints; truth from Ohm's law and the Beta formula (ClosedForm).
        for (var code = table.Span.FirstCode; code <= table.Span.LastCode; code++)
        {
            var truth = side == SensorSide.Low ? ClosedForm.NtcLowSideCelsius(code) : ClosedForm.NtcHighSideCelsius(code);
            var error = table.EvaluateCelsius(code) - truth;
            Assert.True(Math.Abs(error) <= boundKelvin + 1e-9, $"bound {boundKelvin} K: code {code} is {error:G4} K off");
        }
        Assert.True(table.Codes.Count < table.Span.Count / 4, $"{table.Codes.Count} breakpoints for {table.Span.Count} codes is no saving");
    }

    [Fact]
    public void A_looser_bound_never_needs_more_breakpoints()
    {
        var model = FirmwareTestModels.NtcLowSide();
        var counts = new[] { 0.01, 0.02, 0.05, 0.1, 0.2, 0.5 }.Select(b => TableBuilder.WithinBound(model, FixedPointScale.CentiKelvin, b).Codes.Count).ToArray();
        for (var i = 1; i < counts.Length; i++) Assert.True(counts[i] <= counts[i - 1], $"counts {string.Join(", ", counts)}");
    }

    [Fact]
    public void Given_a_count_the_bound_cannot_be_tightened_much_further()
    {
        var model = FirmwareTestModels.NtcLowSide();
        var table = TableBuilder.WithBreakpoints(model, FixedPointScale.CentiKelvin, 16);
        var achieved = TableErrorAnalysis.Evaluate(model, table).MaxAbsErrorKelvin;
        Assert.True(table.Codes.Count <= 16);
        // Bisection on the bound: 2 % less error must cost more than 16 breakpoints with the same placement.
        Assert.True(TableBuilder.WithinBound(model, FixedPointScale.CentiKelvin, achieved * 0.98).Codes.Count > 16);
    }

    [Fact]
    public void Span_runs_between_the_codes_of_the_range_ends()
    {
        // V = 3.3·R/(R + 10k) by Ohm's law, code = V/Q (IEEE Std 1241, Q = Vref/2^N); the span holds the codes whose
        // centre lies inside −40…125 °C, so it starts at ceil(code at 125 °C) and ends at floor(code at −40 °C).
        var span = CodeTemperatures.Span(FirmwareTestModels.NtcLowSide());
        double CodeAt(double t) => ClosedForm.LowSideVolts(ClosedForm.BetaOhms(t), 3.3, 10_000) / (3.3 / 4096);
        Assert.Equal((int)Math.Ceiling(CodeAt(125)), span.FirstCode);
        Assert.Equal((int)Math.Floor(CodeAt(-40)), span.LastCode);
        Assert.False(span.TemperatureRisesWithCode);
    }

    [Theory]
    [InlineData(100)]
    [InlineData(10)]
    public void Every_code_table_is_within_half_an_LSB_plus_half_a_unit_of_the_temperature_that_made_the_code(int unitsPerKelvin)
    {
        // IEEE Std 1241: an ideal converter's quantisation error is ±Q/2, so the temperature behind a code lies within
        // the code's bin; mapped to K the bin edges are T((code ± ½)·Q). The table adds its fixed-point rounding, ±½ unit
        // (common practice, no source). Temperatures sweep the range every 0.01 K; the code comes from Ohm's law.
        var model = FirmwareTestModels.NtcLowSide();
        var scale = new FixedPointScale(unitsPerKelvin);
        var table = TableBuilder.EveryCode(model, scale);
        for (var t = -39.5; t <= 124.5; t += 0.01)
        {
            var code = (int)Math.Round(ClosedForm.LowSideVolts(ClosedForm.BetaOhms(t), 3.3, 10_000) / (3.3 / 4096), MidpointRounding.AwayFromZero);
            var centre = ClosedForm.NtcLowSideCelsius(code);
            var halfBin = Math.Max(Math.Abs(ClosedForm.NtcLowSideCelsius(code - 0.5) - centre), Math.Abs(ClosedForm.NtcLowSideCelsius(code + 0.5) - centre));
            var error = table.EvaluateCelsius(code) - t;
            Assert.True(Math.Abs(error) <= halfBin + 0.5 / unitsPerKelvin + 1e-9,
                $"{t:0.00} °C → code {code}: table {table.EvaluateCelsius(code)} °C, error {error:G4} K, half bin {halfBin:G4} K");
        }
    }

    [Fact]
    public void Table_error_of_an_every_code_table_is_only_the_rounding()
    {
        var model = FirmwareTestModels.NtcLowSide();
        var error = TableErrorAnalysis.Evaluate(model, TableBuilder.EveryCode(model, FixedPointScale.CentiKelvin));
        Assert.True(error.MaxAbsErrorKelvin <= 0.005 + 1e-12, $"{error.MaxAbsErrorKelvin} K");
        // The converter's half bin at the hot end, from the Beta formula at the bin edges (ClosedForm).
        var code = error.HalfCodeAtCode;
        var expected = Math.Max(Math.Abs(ClosedForm.NtcLowSideCelsius(code - 0.5) - ClosedForm.NtcLowSideCelsius(code)),
            Math.Abs(ClosedForm.NtcLowSideCelsius(code + 0.5) - ClosedForm.NtcLowSideCelsius(code)));
        Tolerance.AssertClose(expected, error.HalfCodeKelvin, rel: 1e-9, what: "half-bin K");
    }

    [Fact]
    public void A_bound_below_the_unit_rounding_is_refused()
    {
        var e = Assert.Throws<FirmwareInputException>(() => TableBuilder.WithinBound(FirmwareTestModels.NtcLowSide(), FixedPointScale.DeciKelvin, 0.01));
        Assert.Contains("finer unit", e.Message);
    }

    [Fact]
    public void Loading_correction_shifts_the_true_temperature_by_the_correction_in_codes()
    {
        // A node sitting δ above the unloaded divider reads code·Q for the temperature whose unloaded voltage is code·Q − δ.
        var delta = 0.3 * (3.3 / 4096);
        var model = FirmwareTestModels.NtcLowSide() with { LoadingCorrectionVolts = _ => delta };
        Tolerance.AssertClose(ClosedForm.NtcLowSideCelsius(2000 - 0.3), CodeTemperatures.TrueCelsius(model, 2000), rel: 0, abs: 1e-9);
    }
}
