using ThermVerify.Design;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

public class FaultAnalysisTests
{
    [Fact]
    public void Low_side_sensor_open_reads_full_scale_and_shorted_reads_zero()
    {
        // Ohm's law with no current into the ADC: an open low-side sensor leaves the node at the excitation through the
        // fixed resistor (3.3 V = Vref → clamped to full scale 4095); a short puts it at ground, code 0.
        var faults = FaultAnalysis.Thresholds(FirmwareTestModels.NtcLowSide(), FaultTolerances.None);
        Assert.Equal(new FaultCode(FaultKind.SensorOpen, true, 4095, 4095), faults.For(FaultKind.SensorOpen));
        Assert.Equal(new FaultCode(FaultKind.SensorShorted, false, 0, 0), faults.For(FaultKind.SensorShorted));
        Assert.Equal(new FaultCode(FaultKind.FixedOpen, false, 0, 0), faults.For(FaultKind.FixedOpen));
        Assert.Equal(new FaultCode(FaultKind.FixedShorted, true, 4095, 4095), faults.For(FaultKind.FixedShorted));
    }

    [Fact]
    public void High_side_faults_go_to_the_other_rails()
    {
        var faults = FaultAnalysis.Thresholds(FirmwareTestModels.NtcLowSide(SensorSide.High), FaultTolerances.None);
        Assert.Equal(0, faults.For(FaultKind.SensorOpen).MaxCode);
        Assert.Equal(4095, faults.For(FaultKind.SensorShorted).MinCode);
        Assert.Equal(4095, faults.For(FaultKind.FixedOpen).MinCode);
        Assert.Equal(0, faults.For(FaultKind.FixedShorted).MaxCode);
    }

    [Fact]
    public void An_excitation_below_the_reference_reads_its_own_code_with_tolerance()
    {
        // Open sensor on the low side: node = excitation. 2.5 V on a 3.3 V, 12-bit ADC is 2.5/3.3·4096 = 3103.03 → 3103.
        // With ±1 % on both, the extremes are 2.5·0.99/(3.3·1.01)·4096 = 3041.6 → 3042 and 2.5·1.01/(3.3·0.99)·4096 = 3165.6 → 3166.
        var model = FirmwareTestModels.NtcLowSide() with { ExcitationVolts = 2.5, Range = new(0, 100) };
        Assert.Equal(3103, FaultAnalysis.Thresholds(model, FaultTolerances.None).For(FaultKind.SensorOpen).MinCode);
        var spread = FaultAnalysis.Thresholds(model, new FaultTolerances(0.01, 0.01)).For(FaultKind.SensorOpen);
        Assert.Equal((3042, 3166), (spread.MinCode, spread.MaxCode));
        // A ratiometric front end cancels both.
        var ratiometric = FaultAnalysis.Thresholds(model, new FaultTolerances(0.01, 0.01, ExcitationTracksReference: true)).For(FaultKind.SensorOpen);
        Assert.Equal((3103, 3103), (ratiometric.MinCode, ratiometric.MaxCode));
    }

    [Fact]
    public void Thresholds_separate_every_healthy_code_from_every_fault_code()
    {
        var model = FirmwareTestModels.NtcLowSide();
        var tolerances = new FaultTolerances(0.01, 0.005, 0.01);
        var faults = FaultAnalysis.Thresholds(model, tolerances);
        // Worst healthy codes by Ohm's law at the range ends and the tolerance corners that push them outward:
        // 125 °C (lowest voltage) with the fixed resistor 1 % high, excitation 1 % low and reference 0.5 % high.
        var lowest = (int)Math.Round(ClosedForm.LowSideVolts(ClosedForm.BetaOhms(125), 3.3 * 0.99, 10_100) / (3.3 * 1.005 / 4096), MidpointRounding.AwayFromZero);
        var highest = (int)Math.Round(ClosedForm.LowSideVolts(ClosedForm.BetaOhms(-40), 3.3 * 1.01, 9_900) / (3.3 * 0.995 / 4096), MidpointRounding.AwayFromZero);
        Assert.Equal((lowest, Math.Min(highest, 4095)), (faults.LowestValidCode, faults.HighestValidCode));
        for (var code = 0; code <= 4095; code++)
        {
            var healthy = code >= faults.LowestValidCode && code <= faults.HighestValidCode;
            if (healthy) Assert.False(faults.IsFault(code), $"healthy code {code} flagged");
        }
        foreach (var fault in faults.Faults)
            for (var code = fault.MinCode; code <= fault.MaxCode; code++)
                Assert.True(faults.IsFault(code), $"{fault.Kind} code {code} not flagged");
        Assert.True(faults.FaultBelowCode > 0 && faults.FaultAboveCode < 4095);
    }

    [Fact]
    public void A_range_reaching_the_rail_is_refused()
    {
        // At −40 °C the β = 3435 K model gives 10 kΩ·exp(3435·(1/233.15 − 1/298.15)) ≈ 248 kΩ; over a 100 Ω fixed resistor the
        // node sits at 3.3·248/248.1 V, about 2 codes below full scale.
        var model = FirmwareTestModels.NtcLowSide(fixedOhms: 100);
        var e = Assert.Throws<FirmwareInputException>(() => FaultAnalysis.Thresholds(model, FaultTolerances.None));
        Assert.Contains("too close to the fault codes", e.Message);
    }
}
