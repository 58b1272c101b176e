using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// Worst case and Monte Carlo over a netlist's [[netlist.part]] tolerances go through the same machinery as the
/// built-in shape: the attic fan redrawn as a netlist gives the built-in shape's worst case and, from the same seed,
/// its Monte Carlo statistics; and a plain netlist divider's worst case is the divider worked by hand.
/// </summary>
public class NetlistToleranceTests
{
    private static FrontEndDesign Example(string file) => DesignLoader.Load(Path.Combine(Repository.Netlists, file));

    [Fact]
    public void The_attic_fan_as_a_netlist_has_the_built_in_worst_case()
    {
        var options = new WorstCaseOptions { Threads = 2 };
        var shape = WorstCase.Run(Example("attic-fan-leaky-pin.toml"), options);
        var netlist = WorstCase.Run(Example("attic-fan-leaky-pin-netlist.toml"), options);
        // The netlist's Rfixed takes the place of the divider's fixed resistor, its tolerance and tempco in the same order.
        Assert.Equal(shape.Parameters.Select(p => (p.HalfWidth, p.Unit)), netlist.Parameters.Select(p => (p.HalfWidth, p.Unit)));
        Assert.Equal(
            [ToleranceKind.SensorResistance, ToleranceKind.SensorBeta, ToleranceKind.NetlistPartValue, ToleranceKind.NetlistPartTempco],
            netlist.Parameters.Select(p => p.Kind));
        Assert.Equal(["netlist.part.Rfixed.tolerance", "netlist.part.Rfixed.tempco"], netlist.Parameters.Skip(2).Select(p => p.Key));
        Assert.False(netlist.WithinBudget);
        AssertSameWorstCase(shape, netlist);
    }

    /// <summary>
    /// The soil probe, whose divider the firmware switches on only to measure, as a netlist with a PULSE excitation and
    /// switch_on_lead: every unit's first sample after switch-on is simulated (the built-in shape's GPIO against the
    /// netlist's pulse), and the worst case is the built-in shape's.
    /// </summary>
    [Fact]
    public void The_switched_soil_probe_as_a_netlist_has_the_built_in_worst_case()
    {
        var options = new WorstCaseOptions { Threads = 2 };
        var shape = WorstCase.Run(Example("soil-probe-switched.toml"), options);
        var netlist = WorstCase.Run(Example("soil-probe-switched-netlist.toml"), options);
        Assert.Equal(shape.Parameters.Select(p => (p.HalfWidth, p.Unit)), netlist.Parameters.Select(p => (p.HalfWidth, p.Unit)));
        AssertSameWorstCase(shape, netlist);
    }

    private static void AssertSameWorstCase(WorstCaseResult shape, WorstCaseResult netlist)
    {
        Assert.Equal(shape.CornersEvaluated, netlist.CornersEvaluated);
        Assert.Equal(shape.WithinBudget, netlist.WithinBudget);
        Assert.Equal(shape.Points.Count, netlist.Points.Count);
        for (var i = 0; i < shape.Points.Count; i++)
        {
            var (a, b) = (shape.Points[i], netlist.Points[i]);
            var at = $"at {a.Celsius} °C";
            foreach (var (what, x, y) in new[]
                     {
                         ("nominal", a.NominalKelvin, b.NominalKelvin), ("high corner", a.HighKelvin, b.HighKelvin), ("low corner", a.LowKelvin, b.LowKelvin),
                         ("linear sum", a.LinearSumKelvin, b.LinearSumKelvin), ("RSS", a.RssKelvin, b.RssKelvin), ("sigma", a.SigmaKelvin, b.SigmaKelvin),
                         ("noise", a.NoiseKelvin, b.NoiseKelvin),
                     })
                Tolerance.AssertClose(x, y, 0, 1e-6, $"{what} {at}");
        }
        for (var k = 0; k < shape.Sensitivities.Count; k++)
            for (var i = 0; i < shape.Points.Count; i++)
                Tolerance.AssertClose(shape.Sensitivities[k].KelvinPerUnit[i], netlist.Sensitivities[k].KelvinPerUnit[i], 1e-6, 1e-6,
                    $"sensitivity to {netlist.Sensitivities[k].Parameter.Key} at {shape.Points[i].Celsius} °C");
    }

    [Fact]
    public void The_attic_fan_as_a_netlist_has_the_built_in_monte_carlo_statistics_from_the_same_seed()
    {
        var options = new MonteCarloOptions { Units = 300, Seed = 7, Threads = 2 };
        var shape = MonteCarlo.Run(Example("attic-fan-leaky-pin.toml"), options);
        var netlist = MonteCarlo.Run(Example("attic-fan-leaky-pin-netlist.toml"), options);
        // The same seed draws the same deviations for the same parameters in the same order.
        for (var u = 0; u < options.Units; u++)
            Assert.Equal(shape.Deviations[u], netlist.Deviations[u]);
        Assert.Equal(shape.UnitsWithinBudget, netlist.UnitsWithinBudget);
        Assert.Equal(shape.UnitWithinBudget, netlist.UnitWithinBudget);
        for (var u = 0; u < options.Units; u++)
            Tolerance.AssertClose(shape.WorstErrorKelvin[u], netlist.WorstErrorKelvin[u], 0, 1e-6, $"worst error of unit {u}");
        for (var i = 0; i < shape.Envelope.Count; i++)
        {
            var (a, b) = (shape.Envelope[i], netlist.Envelope[i]);
            var at = $"at {a.Celsius} °C";
            Tolerance.AssertClose(a.MinKelvin, b.MinKelvin, 0, 1e-6, $"min {at}");
            Tolerance.AssertClose(a.MaxKelvin, b.MaxKelvin, 0, 1e-6, $"max {at}");
            Tolerance.AssertClose(a.MeanKelvin, b.MeanKelvin, 0, 1e-6, $"mean {at}");
            Tolerance.AssertClose(a.StandardDeviationKelvin, b.StandardDeviationKelvin, 0, 1e-6, $"standard deviation {at}");
            for (var p = 0; p < a.PercentileKelvin.Count; p++)
                Tolerance.AssertClose(a.PercentileKelvin[p], b.PercentileKelvin[p], 0, 1e-6, $"percentile {options.Percentiles[p]} {at}");
        }
        Assert.Equal(shape.ContributorsCelsius, netlist.ContributorsCelsius);
        Tolerance.AssertClose(shape.VarianceKelvinSquared, netlist.VarianceKelvinSquared, 1e-6, 1e-12, "variance at the widest point");
        for (var k = 0; k < shape.Contributors.Count; k++)
            Tolerance.AssertClose(shape.Contributors[k].Share, netlist.Contributors[k].Share, 1e-6, 1e-9, $"variance share {k}");
    }

    private const double R25 = 10e3, Beta = 3435, Top = 10e3;

    /// <summary>
    /// The temperature the firmware reports when the top resistor of a ratiometric divider is off by a fraction δ, worked
    /// by hand: the pin reads E·R_s/(R_s + R_top(1 + δ)), the firmware inverts with the nominal R_top and so reads
    /// R_s/(1 + δ); the β equation 1/T = 1/T₀ + ln(R/R₀)/β then gives 1/T' = 1/T − ln(1 + δ)/β (the Beta model of an NTC,
    /// IEC 60539-1 terms; the algebra worked from memory, no source needed beyond Ohm's law).
    /// </summary>
    private static double ReadKelvinError(double celsius, double delta)
    {
        var kelvin = celsius + 273.15;
        return 1 / (1 / kelvin - Math.Log(1 + delta) / Beta) - kelvin;
    }

    private static FrontEndDesign HandDivider(string part, string? board = null, string source = "", bool fixedReference = false)
    {
        var folder = Directory.CreateTempSubdirectory("tv-netlist-tol-");
        try
        {
            File.WriteAllText(Path.Combine(folder.FullName, "d.cir"),
                "* a plain NTC divider read ratiometrically\nVexc top 0 DC 3.3\nRtop top mid 10k\nRntc mid 0 10k\n.end\n");
            File.WriteAllText(Path.Combine(folder.FullName, "d.toml"), $"""
                name = "hand divider"
                [sensor]
                model = "beta"
                r25 = "10 kohm"
                beta = {Beta}
                [netlist]
                file = "d.cir"
                sensor = "Rntc"
                pin = "mid"
                {(fixedReference ? "" : "reference = \"top\"")}
                excitation = ["Vexc"]
                [[netlist.part]]
                {part}
                {source}
                [adc]
                bits = 16
                reference = "{(fixedReference ? "3.3 V" : "ratiometric")}"
                sample_rate = "1 kHz"
                acquisition_time = "10 us"
                sampling_capacitance = "5 pF"
                switch_resistance = "1 kohm"
                [check]
                range = "0 degC .. 50 degC"
                step = "5 K"
                budget = "1 K"
                {(board is null ? "" : $"board_temperature = \"{board}\"")}
                """);
            return DesignLoader.Load(Path.Combine(folder.FullName, "d.toml"));
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Fact]
    public void A_netlist_dividers_worst_case_is_the_divider_worked_by_hand()
    {
        var result = WorstCase.Run(HandDivider("name = \"Rtop\"\ntolerance = \"1 %\""), new WorstCaseOptions { Threads = 2 });
        var parameter = Assert.Single(result.Parameters);
        Assert.Equal(("Rtop", 0.01), (parameter.Element, parameter.HalfWidth));
        var sensitivity = Assert.Single(result.Sensitivities);
        for (var i = 0; i < result.Points.Count; i++)
        {
            var p = result.Points[i];
            var at = $"at {p.Celsius} °C";
            // A top resistor that is high reads the sensor low: the NTC reads hot. 16 bits: 1 LSB ≤ 2.4 mK here, the
            // sample settles fully (30 ns against 10 µs), so the corners are the hand figures within the quantisation.
            Tolerance.AssertClose(ReadKelvinError(p.Celsius, 0.01), p.HighKelvin, 0, 3e-3, $"high corner {at}");
            Tolerance.AssertClose(ReadKelvinError(p.Celsius, -0.01), p.LowKelvin, 0, 3e-3, $"low corner {at}");
            Tolerance.AssertClose(0, p.NominalKelvin, 0, 3e-3, $"nominal {at}");
            // The sensitivity is the central difference of the unquantised error: no quantisation in it; what is left is the
            // simulated sample's residue (about 10 nV of transient, a few µK), against effects of 0.2 K.
            var central = (ReadKelvinError(p.Celsius, 0.01) - ReadKelvinError(p.Celsius, -0.01)) / 2;
            Tolerance.AssertClose(central, sensitivity.KelvinPerUnit[i] * 0.01, 0, 5e-6, $"sensitivity {at}");
        }
        // At 25 °C, 1 % on the top resistor is about ±0.26 K (the NTC's 3.87 %/K at 25 °C, α = β/T²: common practice).
        var at25 = result.Points.Single(p => p.Celsius == 25);
        Tolerance.AssertClose(0.2584, at25.HighKelvin, 0, 3e-3, "high corner at 25 °C");
    }

    [Fact]
    public void A_netlist_parts_tempco_is_spread_at_the_board_temperature()
    {
        // 100 ppm/K at 85 °C is 0.6 % off the 25 °C value, at either sign: the hand divider with δ = ±0.6 %.
        var result = WorstCase.Run(HandDivider("name = \"Rtop\"\ntempco = \"100 ppm/K\"", board: "85 degC"), new WorstCaseOptions { Threads = 2 });
        var parameter = Assert.Single(result.Parameters);
        Assert.Equal((ToleranceKind.NetlistPartTempco, 100e-6), (parameter.Kind, parameter.HalfWidth));
        var sensitivity = Assert.Single(result.Sensitivities);
        for (var i = 0; i < result.Points.Count; i++)
        {
            var c = result.Points[i].Celsius;
            var central = (ReadKelvinError(c, 0.006) - ReadKelvinError(c, -0.006)) / 2;
            Tolerance.AssertClose(central, sensitivity.KelvinPerUnit[i] * 100e-6, 0, 5e-6, $"tempco's effect at {c} °C");
            Tolerance.AssertClose(ReadKelvinError(c, 0.006), result.Points[i].HighKelvin, 0, 3e-3, $"high corner at {c} °C");
        }
    }

    [Fact]
    public void A_netlist_parts_tempco_follows_the_sweep_without_a_board_temperature()
    {
        // No board temperature: the top resistor sits at the swept temperature, off by ±100 ppm/K·(T − 25 °C).
        var result = WorstCase.Run(HandDivider("name = \"Rtop\"\ntempco = \"100 ppm/K\""), new WorstCaseOptions { Threads = 2 });
        var sensitivity = Assert.Single(result.Sensitivities);
        for (var i = 0; i < result.Points.Count; i++)
        {
            var c = result.Points[i].Celsius;
            var delta = 100e-6 * (c - 25);
            var central = (ReadKelvinError(c, delta) - ReadKelvinError(c, -delta)) / 2;
            Tolerance.AssertClose(central, sensitivity.KelvinPerUnit[i] * 100e-6, 0, 5e-6, $"tempco's effect at {c} °C");
        }
    }

    [Fact]
    public void A_tolerance_on_the_excitation_counts_against_a_fixed_reference()
    {
        // A 3.3 V reference of its own: the excitation 1 % high moves the pin 1 % high, v' = (1 + δ)·E·R/(R + R_top); the
        // firmware inverts with the nominal E and R_top, R' = R_top·v'/(E − v') (Ohm's law), then the β equation.
        var result = WorstCase.Run(HandDivider("name = \"Vexc\"\ntolerance = \"1 %\"", fixedReference: true), new WorstCaseOptions { Threads = 2 });
        var sensitivity = Assert.Single(result.Sensitivities);
        double Read(double celsius, double delta)
        {
            var r = R25 * Math.Exp(Beta * (1 / (celsius + 273.15) - 1 / 298.15));
            var v = (1 + delta) * 3.3 * r / (r + Top);
            var read = Top * v / (3.3 - v);
            return 1 / (1 / 298.15 + Math.Log(read / R25) / Beta) - 273.15 - celsius;
        }
        for (var i = 0; i < result.Points.Count; i++)
        {
            var c = result.Points[i].Celsius;
            Tolerance.AssertClose((Read(c, 0.01) - Read(c, -0.01)) / 2, sensitivity.KelvinPerUnit[i] * 0.01, 0, 5e-6, $"excitation's effect at {c} °C");
            Tolerance.AssertClose(Math.Max(Read(c, 0.01), Read(c, -0.01)), result.Points[i].HighKelvin, 0, 3e-3, $"high corner at {c} °C");
        }
    }

    [Fact]
    public void A_tolerance_on_the_source_that_drives_the_reference_cancels_in_a_ratiometric_reading()
    {
        // The reference node is the excitation's: a unit's reference is its own excitation, as a divider's is. Were the
        // reference left at its nominal, 2 % on the excitation would read about 1 K off (0.02·V/(dV/dT), V/(dV/dT) ≈ 50 K).
        var result = WorstCase.Run(HandDivider("name = \"Vexc\"\ntolerance = \"2 %\""), new WorstCaseOptions { Threads = 2 });
        var sensitivity = Assert.Single(result.Sensitivities);
        Assert.Equal(ToleranceKind.NetlistPartValue, sensitivity.Parameter.Kind);
        Assert.All(sensitivity.KelvinPerUnit, s => Assert.True(Math.Abs(s * 0.02) < 1e-6, $"excitation's effect {s * 0.02} K"));
    }
}
