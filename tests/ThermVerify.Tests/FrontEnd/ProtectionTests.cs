using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using ThermVerify.Tests.Check;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// Protection parts at the converter's input: clamp diodes whose reverse leakage doubles every few kelvin, and the
/// insulation of the sensor's cable. Each is held to its closed form (the Shockley diode equation with Ohm's law; the
/// Thévenin equivalent), to ngspice on the same deck, and to the rule that a bound is taken both ways.
/// </summary>
public class ProtectionTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    private static readonly Lazy<NgspiceEngine> Ngspice = new(() => new NgspiceEngine());

    private static FrontEndDesign Clamped(params (string Path, string? Value)[] more) =>
        TestDesign.Make([("filter.series_resistor", "\"4.7 kohm\""), ("adc.pin_capacitance", "\"5 pF\""), ("protection.clamp_leakage", "\"+50 nA\""), ("protection.clamp_rail", "\"3.3 V\""), .. more]);

    private static double[] Grid(FrontEndDesign d) => [.. SensorTabulation.Grid(d.Check.Range, d.Check.StepKelvin)];

    private static double[] PinSweep(FrontEndDesign design) =>
        ((ICheckEngine)BuiltInEngine.Instance).TemperatureSweep(FrontEndCircuit.Dc(design, null), Grid(design), [FrontEndCircuit.PinNode(design)])[0];

    private static double ThermalVolts(double celsius) =>
        PhysicalConstants.BoltzmannJoulesPerKelvin * PhysicalConstants.ToKelvin(celsius) / PhysicalConstants.ElementaryChargeCoulombs;

    /// <summary>
    /// A reverse-biased junction's current: Shockley's I_s·(1 − e^(−V_r/V_t)) plus the 1e-12 S that SPICE engines
    /// (ngspice and ours) put across every junction.
    /// </summary>
    private static double Reverse(double saturationAmperes, double reverseVolts, double celsius) =>
        saturationAmperes * (1 - Math.Exp(-reverseVolts / ThermalVolts(celsius))) + 1e-12 * reverseVolts;

    /// <summary>Two resistances in parallel: what the pin sees of the divider (Thévenin).</summary>
    private static double Parallel(double a, double b) => a * b / (a + b);

    [Fact]
    public void Keys_are_read_and_written_back()
    {
        var design = Clamped(("protection.insulation_resistance", "\"20 Mohm\""), ("protection.insulation_to", "\"12 V\""),
            ("protection.clamp_temperature", "\"60 degC\""), ("protection.clamp_leakage_doubling", "\"8 K\""));
        var p = design.Protection!;
        Assert.Equal(50e-9, p.ClampLeakageAmperes, 15);
        Assert.True(p.ClampLeakageSigned);
        Assert.Equal((8.0, 60.0, 3.3, 20e6, 12.0), (p.ClampDoublingKelvin, p.ClampCelsius!.Value, p.ClampRailVolts!.Value, p.InsulationOhms!.Value, p.InsulationToVolts));
        var again = DesignLoader.Parse(DesignWriter.ToToml(design), "again.toml", Path.GetTempPath());
        Assert.Equal(p, again.Protection);
    }

    [Theory]
    [InlineData("protection.clamp_rail", "\"3.3 V\"", "clamp_rail without clamp diodes")]
    [InlineData("protection.insulation_to", "\"0 V\"", "insulation_to without insulation_resistance")]
    [InlineData("protection.clamp_leakage_doubling", "\"0 K\"", "clamp_leakage_doubling")]
    [InlineData("protection.insulation_resistance", "\"10 V\"", "wrong unit")]
    [InlineData("protection.clamp_leak", "\"5 nA\"", "unknown key")]
    public void Impossible_protection_is_refused_with_the_key(string key, string value, string words)
    {
        var error = Assert.Throws<DesignException>(() => TestDesign.Make((key, value)));
        Assert.Contains(words, error.Message);
    }

    [Fact]
    public void Clamp_leakage_at_the_board_follows_shockley_and_ohms_law()
    {
        // The upper diode at 45 °C leaks I_s = 50 nA·2^((45 − 25)/10) = 200 nA at reverse bias V_r (Shockley:
        // I = I_s·(1 − e^(−V_r/V_t))) into the pin, through the R_s∥R_f + 4.7 kΩ the pin sees (Ohm's law). The shift
        // changes V_r by microvolts, which changes the current by far less than the tolerance.
        var design = Clamped(("check.board_temperature", "\"45 degC\""));
        var bare = PinSweep(design with { Protection = null });
        var clamped = PinSweep(design);
        var grid = Grid(design);
        var sensor = design.Sensor.Build();
        for (var i = 0; i < grid.Length; i++)
        {
            var rs = sensor.ResistanceOhms(grid[i]);
            var source = Parallel(rs, 10e3) + 4.7e3;
            var expected = Reverse(200e-9, 3.3 - bare[i], 45) * source;
            // 10 nV: both sweeps' node voltages are converged to about 1e-9 of their few volts.
            Tolerance.AssertClose(expected, clamped[i] - bare[i], 1e-6, 1e-8, $"clamp shift at {grid[i]} °C");
        }
        // The check's closed form says the same beside the simulation.
        var point = FrontEndCheck.Run(design, Options).Points[^1];
        Tolerance.AssertClose(clamped[^1] - bare[^1], point.Estimates.ClampVolts, 1e-3, 1e-12, "closed form in the check");
    }

    [Fact]
    public void A_series_resistor_alone_at_the_pin_is_checked_like_a_wire()
    {
        // Nothing but the converter's input after the resistor: no DC current flows, so the pin is the divider's
        // voltage (its input is the open sampling switch, 1 TΩ, which moves it by R/1 TΩ of the voltage: nothing).
        var design = TestDesign.Make(("filter.series_resistor", "\"1 kohm\""));
        var pin = PinSweep(design);
        var wire = PinSweep(TestDesign.Make());
        for (var i = 0; i < pin.Length; i++)
            Tolerance.AssertClose(wire[i], pin[i], 1e-8, 0, $"point {i}");
        Assert.True(FrontEndCheck.Run(design, Options).Points.Count > 0);
    }

    [Fact]
    public void Insulation_pulls_the_sensor_node_as_thevenin_says()
    {
        // Linear, so Thévenin's theorem is exact: ΔV = (V_ins − V_th)·R_th/(R_th + R_ins), R_th = R_s∥R_f.
        var design = TestDesign.Make(("protection.insulation_resistance", "\"1 Mohm\""), ("protection.insulation_to", "\"12 V\""));
        var bare = PinSweep(design with { Protection = null });
        var leaky = PinSweep(design);
        var grid = Grid(design);
        var sensor = design.Sensor.Build();
        for (var i = 0; i < grid.Length; i++)
        {
            var rs = sensor.ResistanceOhms(grid[i]);
            var rth = Parallel(rs, 10e3);
            Tolerance.AssertClose((12 - bare[i]) * rth / (rth + 1e6), leaky[i] - bare[i], 1e-9, 1e-12, $"insulation shift at {grid[i]} °C");
        }
    }

    [Fact]
    public void A_clamp_leakage_without_a_sign_is_taken_both_ways()
    {
        // Unsigned: one diode or the other leaks. The bound is in the circuit's bounds, and the check's two corners
        // move the pin by the upper diode's shift up and by the same shift down.
        var design = Clamped(("protection.clamp_leakage", "\"50 nA\""), ("check.board_temperature", "\"45 degC\""));
        var bound = Assert.Single(StaticBounds.InCircuit(design));
        Assert.Equal(("protection.clamp_leakage", 50e-9), (bound.Key, bound.Magnitude));
        var result = FrontEndCheck.Run(design, Options);
        Assert.Contains(result.Points, p => p.Corner == "bounds up");
        Assert.Contains(result.Points, p => p.Corner == "bounds down");
        var finding = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        Assert.Contains("one clamp diode's reverse leakage ±200 nA (a bound) at 45 °C", finding.Cause);

        // The lower diode alone (a negative value with its sign) moves the pin down as the upper one moves it up, each
        // by its own reverse current (the biases differ: V_pin for the lower, 3.3 V − V_pin for the upper).
        var lower = PinSweep(Clamped(("protection.clamp_leakage", "\"-50 nA\""), ("check.board_temperature", "\"45 degC\"")));
        var none = PinSweep(design with { Protection = null });
        var grid = Grid(design);
        var sensor = design.Sensor.Build();
        for (var i = 0; i < grid.Length; i++)
        {
            var rs = sensor.ResistanceOhms(grid[i]);
            var source = Parallel(rs, 10e3) + 4.7e3;
            Tolerance.AssertClose(-Reverse(200e-9, none[i], 45) * source, lower[i] - none[i], 1e-6, 1e-8, $"lower diode at {grid[i]} °C");
        }
    }

    [Fact]
    public void Remedies_name_the_leakage_and_the_series_resistor_the_budget_allows_and_each_passes_when_applied()
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, "collector-pump-clamped.toml"));
        var result = FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 3 });
        Assert.False(result.Passed);
        var over = Assert.Single(result.Findings, f => f.Id == FindingRules.OverBudgetId);
        var leakage = Assert.Single(over.Remedies, r => r.Key == "protection.clamp_leakage");
        var series = Assert.Single(over.Remedies, r => r.Key == "filter.series_resistor");
        Assert.InRange(leakage.Value!.Value, 1e-9, 20e-9);
        Assert.InRange(series.Value!.Value, 100, 4.7e3);
        // Proven again here, independently of the remedy search: the design with the value applied passes.
        Assert.True(FrontEndCheck.Run(design with { Protection = design.Protection! with { ClampLeakageAmperes = leakage.Value.Value } }, Options).Passed);
        Assert.True(FrontEndCheck.Run(design with { Filter = design.Filter with { SeriesResistorOhms = series.Value.Value } }, Options).Passed);
    }

    [NgspiceFact]
    public void Clamp_leakage_following_the_sweep_agrees_with_ngspice_and_doubles_every_interval()
    {
        // Without a board temperature the diodes follow the sweep; ngspice runs the same law as a behavioural source.
        var design = Clamped(("protection.clamp_leakage_doubling", "\"8 K\""));
        var grid = Grid(design);
        var circuit = FrontEndCircuit.Dc(design, null);
        string[] nodes = [FrontEndCircuit.PinNode(design)];
        var ours = ((ICheckEngine)BuiltInEngine.Instance).TemperatureSweep(circuit, grid, nodes)[0];
        var theirs = ((ICheckEngine)Ngspice.Value).TemperatureSweep(circuit, grid, nodes)[0];
        var bare = PinSweep(design with { Protection = null });
        var sensor = design.Sensor.Build();
        for (var i = 0; i < grid.Length; i++)
        {
            Tolerance.AssertClose(theirs[i], ours[i], 0, 1e-6, $"ngspice at {grid[i]} °C");
            var rs = sensor.ResistanceOhms(grid[i]);
            var expected = Reverse(50e-9 * Math.Pow(2, (grid[i] - 25) / 8), 3.3 - bare[i], grid[i]) * (Parallel(rs, 10e3) + 4.7e3);
            Tolerance.AssertClose(expected, ours[i] - bare[i], 1e-6, 1e-8, $"doubling law at {grid[i]} °C");
        }
    }
}
