using ThermVerify.Check.DeltaSigma;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Quantities;
using ThermVerify.Tests.Design;

namespace ThermVerify.Tests.Check;

/// <summary>The noise of a delta-sigma reading: the front end's density through the digital filter, the converter's noise from its table.</summary>
public class DeltaSigmaNoiseTests
{
    [Fact]
    public void A_resistive_source_gives_4kTR_times_the_filters_noise_bandwidth()
    {
        // The bare divider has no capacitor at the pin: its density is flat, 4kT·(R_s ∥ R_f) (Johnson–Nyquist; k exact,
        // SI Brochure 9th ed.), so the filtered variance is that density times the filter's noise bandwidth.
        var design = DeltaSigmaDesigns.Make();
        var filter = SincFilter.Of(design.Adc.DeltaSigma!);
        var model = new ClosedFormModel(design);
        var point = model.At(25);
        var r = point.SensorOhms * 10e3 / (point.SensorOhms + 10e3);
        var expected = Math.Sqrt(4 * PhysicalConstants.BoltzmannJoulesPerKelvin * PhysicalConstants.ToKelvin(25) * r * filter.NoiseBandwidthHertz);
        var actual = DeltaSigmaNoise.AnalogRmsVolts(design, 25, DeltaSigmaNoise.Grid(filter));
        Tolerance.AssertClose(expected, actual, 5e-3, 0, "filtered thermal noise");
    }

    [Fact]
    public void The_converter_noise_is_the_tables_row_and_a_mean_of_N_readings_divides_it_by_root_N()
    {
        var text = DeltaSigmaDesigns.WithNoiseTable(DeltaSigmaDesigns.TwoRows)
            .Replace("gain = 4\n", "gain = 1\n").Replace("input = \"buffered\"", "input = \"unbuffered\"\nsampling_capacitance = \"8 pF\"")
            .Replace("input_current = \"+2 nA\"\n", "").Replace("[check]", "[noise]\nreadings_averaged = 16\n\n[check]");
        var design = DesignLoader.Parse(text, "ds.toml", Path.GetTempPath());
        var filter = SincFilter.Of(design.Adc.DeltaSigma!);
        var model = new ClosedFormModel(design);
        var n = DeltaSigmaNoise.At(design, model, 25, DeltaSigmaNoise.Grid(filter), filter);
        Assert.Equal(0.4e-6, n.ConverterRmsVolts, 15);
        // No capacitor: the front end's readings are independent too (ρ = 0), so the mean of 16 is σ/4 (σ/√N).
        Assert.Equal(0, n.Correlation);
        Tolerance.AssertClose(n.SingleRmsVolts / 4, n.AveragedRmsVolts, 1e-12, 0, "mean of 16");
        Assert.True(design.Adc.NoiseDeclared);
    }
}
