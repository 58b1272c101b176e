using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tests.Firmware;

/// <summary>
/// The converter's transfer convention and the firmware's inverse reach the tables, the table verification and the
/// fault thresholds. The reference values are the hand formulas of <see cref="ClosedForm"/> (Ohm's law and the Beta
/// model solved for T) at the voltage each convention assigns a code: code·Q, (code − ½)·Q, (code + ½)·Q.
/// </summary>
public class ConventionTests
{
    private static FirmwareModel Model(FirstTransition first, CodeInverse inverse) =>
        FirmwareTestModels.NtcLowSide() with { Adc = new AdcTransfer(12, 3.3) { FirstTransition = first, Inverse = inverse } };

    [Theory]
    [InlineData(FirstTransition.HalfLsb, CodeInverse.BinMiddle, 0.0)]
    [InlineData(FirstTransition.HalfLsb, CodeInverse.BinEdge, -0.5)]
    [InlineData(FirstTransition.OneLsb, CodeInverse.BinMiddle, 0.5)]
    [InlineData(FirstTransition.OneLsb, CodeInverse.BinEdge, 0.0)]
    public void Table_values_are_the_temperatures_at_the_voltage_each_convention_reads_a_code_as(FirstTransition first, CodeInverse inverse, double offsetLsb)
    {
        var model = Model(first, inverse);
        var table = TableBuilder.EveryCode(model, FixedPointScale.CentiKelvin);
        foreach (var code in new[] { 600, 1500, 2048, 3000 })
        {
            var truth = ClosedForm.NtcLowSideCelsius(code + offsetLsb);
            // The table stores the truth rounded to 0.01 K (FixedPointScale.CentiKelvin): within 0.005 K of it.
            Tolerance.AssertClose(truth, table.EvaluateCelsius(code), 0, 0.005 + 1e-9, $"code {code}");
        }
    }

    [Fact]
    public void A_table_made_with_one_convention_verifies_against_it_and_not_against_the_other()
    {
        // A firmware table written by another tool that truncates (first transition at 1 LSB) and reads the middle of
        // each bin; the temperatures are the hand formula at (code + ½)·Q, written to 0.001 K.
        var rows = Enumerable.Range(500, 3000).Select(code => new TableRow(code - 499, code, Math.Round(ClosedForm.NtcLowSideCelsius(code + 0.5), 3))).ToList();
        var matching = TableVerifier.Verify(Model(FirstTransition.OneLsb, CodeInverse.BinMiddle), rows, 0.002);
        Assert.True(matching.Passes, $"the table disagrees by {matching.MaxAbsErrorKelvin} K with its own convention");
        var other = TableVerifier.Verify(Model(FirstTransition.HalfLsb, CodeInverse.BinMiddle), rows, 0.002);
        Assert.False(other.Passes);
        // Half a code apart: the difference is the temperature span of half an LSB (tens of mK at the ends of the range).
        Assert.InRange(other.MaxAbsErrorKelvin, 0.01, 0.2);
    }

    [Fact]
    public void Fault_thresholds_quantise_the_healthy_extremes_with_the_convention()
    {
        // Healthy extremes at the range ends with no tolerances: V = 3.3·R/(R + 10 kΩ), code = round(V/Q) or floor(V/Q).
        double Code(double celsius) => ClosedForm.LowSideVolts(ClosedForm.BetaOhms(celsius), 3.3, 10_000) / (3.3 / 4096);
        var round = FaultAnalysis.Thresholds(Model(FirstTransition.HalfLsb, CodeInverse.BinMiddle), FaultTolerances.None);
        var floor = FaultAnalysis.Thresholds(Model(FirstTransition.OneLsb, CodeInverse.BinMiddle), FaultTolerances.None);
        Assert.Equal((int)Math.Round(Code(125), MidpointRounding.AwayFromZero), round.LowestValidCode);
        Assert.Equal((int)Math.Round(Code(-40), MidpointRounding.AwayFromZero), round.HighestValidCode);
        Assert.Equal((int)Math.Floor(Code(125)), floor.LowestValidCode);
        Assert.Equal((int)Math.Floor(Code(-40)), floor.HighestValidCode);
        // The rails: an open or shorted part reads 0 or full scale under either convention.
        Assert.Equal(4095, floor.For(FaultKind.SensorOpen).MinCode);
        Assert.Equal(0, floor.For(FaultKind.SensorShorted).MaxCode);
    }
}
