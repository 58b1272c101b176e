using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Tests.Design;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.FrontEnd.DeltaSigma;

/// <summary>
/// The unbuffered input's load: the switched-capacitor transient, the average resistor R_eq = 1/(f_mod·C) and the
/// closed form V_th·R_eq/(R_s + R_eq) (D. Johns, K. Martin, Analog Integrated Circuit Design, 1997, switched-capacitor
/// chapter, from memory), for the test converter: 256 kHz, 8 pF, so R_eq = 488.28 kΩ.
/// </summary>
public class InputLoadingTests
{
    private static readonly ThermVerify.Design.FrontEndDesign Reservoir = DeltaSigmaDesigns.Make(
        ("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""));

    [Fact]
    public void The_equivalent_resistance_is_one_over_f_times_C()
    {
        Assert.Equal(1 / (256e3 * 8e-12), InputLoading.EquivalentOhms(Reservoir.Adc.DeltaSigma!), 6);
        Assert.Equal(488_281.25, InputLoading.EquivalentOhms(Reservoir.Adc.DeltaSigma!), 6);
    }

    [Theory]
    [InlineData(-20)]
    [InlineData(25)]
    [InlineData(80)]
    public void Behind_a_large_reservoir_the_switched_input_draws_its_average_and_agrees_with_the_closed_form(double celsius)
    {
        var load = InputLoading.At(Reservoir, celsius, BuiltInEngine.Instance);
        var point = new ClosedFormModel(Reservoir).At(celsius);
        // R_s: the divider's R_s ∥ R_f plus the filter's 1 kΩ (elementary).
        var rs = point.SensorOhms * 10e3 / (point.SensorOhms + 10e3) + 1e3;
        Assert.Equal(rs, load.SourceOhms, 6);
        // The average resistor in the engine is the closed form (a linear divider): agreement to rounding.
        Tolerance.AssertClose(load.ClosedFormVolts, load.AverageVolts, 1e-12, 1e-15, "average against closed form");
        // The error is large: V·R_s/(R_s + R_eq), about 1 % of the pin voltage here.
        Tolerance.AssertClose(-load.UnloadedVolts * rs / (rs + load.EquivalentOhms), load.AverageVolts - load.UnloadedVolts, 1e-12, 1e-15, "average error");
        // The switched run shows the same error but for the charge shared each period, at most V·C/C_res (common practice, no source).
        var sharing = load.UnloadedVolts * 8e-12 / 100e-9;
        Assert.True(Math.Abs(load.SwitchedVolts - load.AverageVolts) <= sharing,
            $"switched {load.SwitchedVolts} V, average {load.AverageVolts} V, charge sharing bound {sharing} V");
        Assert.True(Math.Abs(load.ErrorVolts) > 50 * sharing, $"error {load.ErrorVolts} V");
    }

    [Fact]
    public void Without_a_reservoir_a_fast_source_recharges_the_capacitor_within_each_period_and_the_error_vanishes()
    {
        // R_s·C = 5 kΩ · 8 pF = 40 ns against a half period of 1.95 µs: e^−48 of the step is left; the average model
        // (which assumes a stiff pin) still predicts 1 %, which is why the switched run is the one the check uses.
        var bare = DeltaSigmaDesigns.Make();
        var load = InputLoading.At(bare, 25, BuiltInEngine.Instance);
        // What is left is the open emptying switch's 1 TΩ to ground: V·R_s/1 TΩ ≈ 8 nV (Ohm's law).
        Assert.True(Math.Abs(load.ErrorVolts) < 1e-7, $"error {load.ErrorVolts} V");
        Assert.True(Math.Abs(load.AverageVolts - load.UnloadedVolts) > 1e-2, $"average error {load.AverageVolts - load.UnloadedVolts} V");
    }

    [Fact]
    public void A_buffered_input_loads_the_pin_by_its_input_current_through_the_source()
    {
        var buffered = DeltaSigmaDesigns.Make(("adc.input", "\"buffered\""), ("adc.sampling_capacitance", null), ("adc.input_current", "\"+5 nA\""),
            ("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""));
        var load = InputLoading.At(buffered, 25, BuiltInEngine.Instance);
        // −I·R_s with R_s = 5 kΩ + 1 kΩ at 25 °C (Ohm's law).
        Tolerance.AssertClose(-5e-9 * 6e3, load.ErrorVolts, 1e-9, 1e-15, "buffered error");
        Tolerance.AssertClose(load.ClosedFormVolts, load.SwitchedVolts, 1e-9, 1e-15, "buffered closed form");
    }

    /// <summary>
    /// ngspice runs the same switched deck (its switches driven by 1 ps control edges): the input capacitor's voltage
    /// half-way through each of the first 40 charging phases agrees within 1 µV with the built-in engine's exact run.
    /// </summary>
    [NgspiceFact]
    public void The_switched_transient_agrees_with_ngspice()
    {
        var design = DeltaSigmaDesigns.Make(("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"1 nF\""));
        var circuit = InputLoading.Switched(design, 25, periods: 60);
        var period = 1 / 256e3;
        var options = new ThermVerify.Simulation.TransientOptions { StopTimeSeconds = 41 * period, MaxStepSeconds = period / 200 };
        using var ngspice = new ThermVerify.Ngspice.NgspiceEngine();
        var ours = ((ICheckEngine)BuiltInEngine.Instance).StartTransient(circuit, options);
        var theirs = ((ICheckEngine)ngspice).StartTransient(circuit, options);
        var first = double.NaN;
        for (var k = 0; k < 40; k++)
        {
            var t = (k + 0.25) * period;
            var a = ours.VoltageAt(t, InputLoading.InputNode);
            if (k == 0) first = a;
            Tolerance.AssertClose(theirs.VoltageAt(t, InputLoading.InputNode), a, 0, 1e-6, $"period {k}");
        }
        // The run is not flat: the 1 nF reservoir loses charge to the input over the periods.
        Assert.True(first - ours.VoltageAt(39.25 * period, InputLoading.InputNode) > 1e-3);
    }
}
