using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// worstcase and montecarlo on a delta-sigma design (netlists/stability-chamber-pt100-pga.toml: a Pt100 in a current
/// loop with a ratiometric reference resistor, 24 bits behind a gain of 8): the units go through the one tolerance
/// machinery and are read through the converter's static transfer.
/// </summary>
public class DeltaSigmaToleranceTests
{
    // IEC 60751 Callendar–Van Dusen coefficients for t ≥ 0 °C: R(t) = R0·(1 + A·t + B·t²) (published standard, from memory).
    private const double R0 = 100, A = 3.9083e-3, B = -5.775e-7;

    private static double Ohms(double celsius) => R0 * (1 + A * celsius + B * celsius * celsius);

    // Its inverse for t ≥ 0 °C, the quadratic's root.
    private static double Celsius(double ohms) => (-A + Math.Sqrt(A * A - 4 * B * (1 - ohms / R0))) / (2 * B);

    /// <summary>
    /// The ratiometric code is 2^N·G·R_s/R_ref (common practice): a reference resistor off by δ reads the sensor as
    /// R_s/(1 + δ), and a gain stage off by ε reads it as R_s·(1 + ε); the firmware reads the code with the nominal
    /// R_ref and G and the IEC 60751 inverse. The effect of the full tolerance a (a central difference at ±a, as
    /// worstcase defines it) is then [T(R_s·f(+a)) − T(R_s·f(−a))]/2, computed here by hand with Callendar–Van Dusen.
    /// </summary>
    [Theory]
    [InlineData("current_source.reference_resistor_tolerance", 2e-4, true)]
    [InlineData("adc.pga_gain_error", 5e-4, false)]
    public void A_sensitivity_of_the_delta_sigma_example_matches_callendar_van_dusen_through_the_ratiometric_code(string key, double a, bool divides)
    {
        var design = ExampleDesigns.Load("stability-chamber-pt100-pga.toml");
        var result = WorstCase.Run(design, new WorstCaseOptions { Threads = 2, MaximumEnumeratedParameters = 0 });
        var sensitivity = result.Sensitivities.Single(s => s.Parameter.Key == key);
        Assert.Equal(a, sensitivity.Parameter.HalfWidth, 12);
        foreach (var celsius in new[] { 0.0, 30.0, 60.0 })
        {
            var k = result.Points.ToList().FindIndex(p => Math.Abs(p.Celsius - celsius) < 1e-9);
            double Read(double deviation) => Celsius(divides ? Ohms(celsius) / (1 + deviation) : Ohms(celsius) * (1 + deviation));
            var expected = (Read(a) - Read(-a)) / 2;
            Tolerance.AssertClose(expected, sensitivity.KelvinPerUnit[k] * a, rel: 2e-3, abs: 2e-5, what: $"{key} at {celsius} °C");
        }
        // Not a zero that cannot fail: the effect is tens of mK and more.
        Assert.True(Math.Abs(sensitivity.KelvinPerUnit[^1] * a) > 0.05);
    }

    [Fact]
    public void The_buffered_inputs_current_spreads_and_loads_each_unit_through_its_source()
    {
        // adc.input_current = "1 nA" is a bound: spread over ±1 nA, the nominal unit has none. A unit with +1 nA into the
        // pin pulls it down by I·R_th, R_th ≈ 1 kΩ filter + the sensor and its two 1.5 Ω leads (the 50 MΩ source and the
        // reference resistor's branch are open to it): −1 nA·R_th/(I_exc·dR/dT) in K, Callendar–Van Dusen slope (closed
        // form of the loaded pin, common practice; IEC 60751, from memory).
        var design = ExampleDesigns.Load("stability-chamber-pt100-pga.toml");
        var result = WorstCase.Run(design, new WorstCaseOptions { Threads = 2, MaximumEnumeratedParameters = 0 });
        var sensitivity = result.Sensitivities.Single(s => s.Parameter.Key == "adc.input_current");
        Tolerance.AssertClose(1e-9, sensitivity.Parameter.HalfWidth, rel: 1e-12);
        foreach (var celsius in new[] { 0.0, 30.0, 60.0 })
        {
            var k = result.Points.ToList().FindIndex(p => Math.Abs(p.Celsius - celsius) < 1e-9);
            var expected = -1e-9 * (1000 + 1.5 + Ohms(celsius) + 1.5) / (250e-6 * R0 * (A + 2 * B * celsius));
            Tolerance.AssertClose(expected, sensitivity.KelvinPerUnit[k] * 1e-9, rel: 5e-3, abs: 1e-6, what: $"input current at {celsius} °C");
        }
    }

    [Fact]
    public void An_unbuffered_units_pin_carries_the_switched_capacitor_resistor_through_its_source()
    {
        // R_eq = 1/(f_mod·C) from the pin to ground (Johns & Martin, Analog Integrated Circuit Design, switched-capacitor
        // resistor, from memory) pulls the pin's Thévenin source V_th, R_s to V_th·R_eq/(R_s + R_eq): a shift of
        // −V_th·R_s/(R_s + R_eq), here held against the unit's simulated levels at every temperature.
        var design = ThermVerify.Tests.Design.DeltaSigmaDesigns.Make();
        var evaluator = new UnitEvaluator(design, threads: 1);
        var unit = BuiltUnit.Build(design, evaluator.Model.Sensor, evaluator.Set, new double[evaluator.Set.Count]).Design;
        var cases = ThermVerify.FrontEnd.PrechargeCases.For(unit, evaluator.Model.Adc.ReferenceVolts);
        var dc = ThermVerify.FrontEnd.DcCorners.Run(unit, cases, evaluator.Temperatures);
        var loaded = ThermVerify.FrontEnd.DeltaSigma.AverageInputLoad.Added(dc, unit, evaluator.Temperatures);
        var req = 1 / (256e3 * 8e-12);
        var model = new ThermVerify.FrontEnd.ClosedFormModel(unit);
        for (var i = 0; i < evaluator.Temperatures.Length; i++)
        {
            var rs = ThermVerify.FrontEnd.DeltaSigma.InputLoading.SourceOhms(unit, model.At(evaluator.Temperatures[i]));
            var expected = -dc.Base.StaticPinVolts[i] * rs / (rs + req);
            Tolerance.AssertClose(expected, loaded.Base.StaticPinVolts[i] - dc.Base.StaticPinVolts[i], rel: 1e-6, abs: 1e-12, what: $"at {evaluator.Temperatures[i]} °C");
        }
        Assert.True(Math.Abs(loaded.Base.StaticPinVolts[0] - dc.Base.StaticPinVolts[0]) > 1e-6);
    }

    [Theory]
    [InlineData("kiln-bank-pt100-deltasigma.toml")]
    [InlineData("stability-chamber-pt100-pga.toml")]
    public void A_units_load_from_its_own_unloaded_sweep_is_the_load_swept_anew(string example)
    {
        // A Monte Carlo unit's base levels are the built-in engine's sweep of its DC circuit, so the average load's
        // shift takes its unloaded pin from them instead of sweeping it again: the levels must be exactly those of the
        // two sweeps, for drawn units of both examples.
        var design = ExampleDesigns.Load(example);
        var evaluator = new UnitEvaluator(design, threads: 1);
        var random = new UnitRandom(3, 0);
        for (var u = 0; u < 3; u++)
        {
            var unit = BuiltUnit.Build(design, evaluator.Model.Sensor, evaluator.Set, evaluator.Set.Sample(ref random)).Design;
            Assert.Empty(ThermVerify.FrontEnd.StaticBounds.InCircuit(unit)); // so the reuse is taken, not the second sweep
            var dc = ThermVerify.FrontEnd.DcCorners.Run(unit, evaluator.Cases, evaluator.Temperatures);
            var reused = ThermVerify.FrontEnd.DeltaSigma.AverageInputLoad.Added(dc, unit, evaluator.Temperatures, builtInLevels: true);
            var swept = ThermVerify.FrontEnd.DeltaSigma.AverageInputLoad.Added(dc, unit, evaluator.Temperatures);
            Assert.Equal(swept.Base.StaticPinVolts, reused.Base.StaticPinVolts);
            for (var c = 0; c < swept.Corners.Count; c++)
                Assert.Equal(swept.Corners[c].StaticPinVolts, reused.Corners[c].StaticPinVolts);
        }
    }

    [Fact]
    public void Montecarlo_of_the_delta_sigma_example_is_reproducible_from_its_seed_on_any_thread_count()
    {
        var design = ExampleDesigns.Load("stability-chamber-pt100-pga.toml");
        MonteCarloResult Run(int threads) => MonteCarlo.Run(design, new MonteCarloOptions { Units = 40, Seed = 5, Threads = threads });
        var one = Run(1);
        var two = Run(2);
        Assert.Equal(one.WorstErrorKelvin, two.WorstErrorKelvin);
        Assert.Equal(one.UnitsWithinBudget, two.UnitsWithinBudget);
        // The units differ from each other: the draw reached them.
        Assert.True(one.WorstErrorKelvin.Distinct().Count() > 30);
        var other = MonteCarlo.Run(design, new MonteCarloOptions { Units = 40, Seed = 6, Threads = 2 });
        Assert.NotEqual(one.WorstErrorKelvin, other.WorstErrorKelvin);
    }
}
