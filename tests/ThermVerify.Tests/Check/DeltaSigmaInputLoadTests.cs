using ThermVerify.Check;
using ThermVerify.Check.DeltaSigma;
using ThermVerify.Design;

namespace ThermVerify.Tests.Check;

/// <summary>
/// A delta-sigma converter's unbuffered input loads the pin at every temperature, and the check's reported error
/// carries that load (it once showed only the unloaded sweep, so a design 5 K off read as within a 0.5 K budget and
/// failed on the input-loading finding alone).
/// </summary>
public class DeltaSigmaInputLoadTests
{
    private static string Example(string name) => Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    [Fact]
    public void The_reported_error_carries_the_switched_capacitor_load_through_a_large_series_resistor()
    {
        var kiln = DesignLoader.Load(Example("kiln-bank-pt100-deltasigma.toml"));
        var design = kiln with { Filter = kiln.Filter with { SeriesResistorOhms = 100e3 } };
        var result = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        var hot = result.Points.Single(p => p.Celsius == 150);

        // By hand: Pt100 at 150 °C from IEC 60751's Callendar–Van Dusen equation, R = R0·(1 + A·t + B·t²),
        // A = 3.9083e-3, B = −5.775e-7; the pin is 500 µA·R. The unbuffered input is, on average, R_eq = 1/(f_mod·C)
        // to ground (switched-capacitor resistor, Johns & Martin), 1/(64 kHz · 2 pF) = 7.8125 MΩ, behind the pin's
        // source: the series 100 kΩ plus what the sensor node shows (its Thevenin resistance; the check states it), so
        // the pin falls by V·R_s/(R_s + R_eq).
        var sensor = 100 * (1 + 3.9083e-3 * 150 - 5.775e-7 * 150 * 150);
        var pin = 500e-6 * sensor;
        var req = 1 / (64e3 * 2e-12);
        var source = hot.Estimates.SourceOhms;
        Assert.InRange(source, 100e3, 100e3 + 4e3 + sensor); // the series resistor plus at most R_ref + R_s (the node's own resistance)
        var expected = -pin * source / (source + req);
        Assert.Equal(expected, hot.Estimates.InputLoadVolts, 1e-9);
        // The simulated DC loading (the switched-capacitor average in the DC circuit) agrees with it within 0.1 %.
        Assert.Equal(expected, hot.Simulated.DcLoadingVolts, Math.Abs(expected) * 1e-3);
        // About −1 mV on 0.19 mV/K (dR/dT = R0·(A + 2·B·t) at 500 µA): about −5.3 K, over the 0.5 K budget.
        var slope = 500e-6 * 100 * (3.9083e-3 + 2 * -5.775e-7 * 150);
        Assert.Equal(expected / slope, hot.ErrorKelvin, 0.05);
        Assert.False(hot.WithinBudget);
        Assert.Contains(result.Findings, f => f.Id == "over-budget");
        // The input-loading finding shows the same size, signed as the error it makes.
        var loading = Assert.Single(result.Findings, f => f.Id == DeltaSigmaFindings.InputLoadingId);
        Assert.True(loading.SizeKelvin < 0);
    }
}
