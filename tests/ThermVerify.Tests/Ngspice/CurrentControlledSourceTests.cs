using ThermVerify.Check;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// SPICE's F (current-controlled current source) and H (current-controlled voltage source) in the built-in engine,
/// against Ohm's law worked by hand and against ngspice, an independent engine reading the deck written from the
/// parsed netlist. The sense is SPICE's: the controlling current flows from the source's + node through it to its −
/// node, and F's current flows from its + node through it to its − node (the ngspice manual, from memory).
/// </summary>
public class CurrentControlledSourceTests
{
    // 3.3 V through 1 kΩ into a 0 V sensing source: I = 3.3 mA. F pushes 2·I into "out" (1 kΩ to ground): 6.6 V.
    // H holds "m" at 500 Ω·I = 1.65 V, driving 1 kΩ. A second F, the other way round, draws 0.5·I out of "back" (2 kΩ): −3.3 V.
    private static Circuit Sensing() => new CircuitBuilder()
        .VoltageSource("Vexc", "a", "0", 3.3)
        .Resistor("Ra", "a", "b", 1e3)
        .VoltageSource("Vsense", "b", "0", 0)
        .Add(new Cccs("Fcopy", "0", "out", "Vsense", 2))
        .Resistor("Ro", "out", "0", 1e3)
        .Add(new Ccvs("Hm", "m", "0", "Vsense", 500))
        .Resistor("Rm", "m", "0", 1e3)
        .Add(new Cccs("Fback", "back", "0", "Vsense", 0.5))
        .Resistor("Rb", "back", "0", 2e3)
        .Build();

    [Fact]
    public void The_operating_point_is_ohms_law_by_hand()
    {
        var op = OperatingPoint.Solve(Sensing());
        const double current = 3.3 / 1e3;
        Tolerance.AssertClose(2 * current * 1e3, op.Voltage("out"), 1e-12, 1e-15, "V(out)");
        Tolerance.AssertClose(500 * current, op.Voltage("m"), 1e-12, 1e-15, "V(m)");
        Tolerance.AssertClose(-0.5 * current * 2e3, op.Voltage("back"), 1e-12, 1e-15, "V(back)");
    }

    [Fact]
    public void A_source_that_is_not_a_voltage_source_cannot_be_sensed()
    {
        var e = Assert.Throws<CircuitException>(() => new CircuitBuilder().VoltageSource("V1", "a", "0", 1).Resistor("R1", "a", "0", 1e3)
            .Add(new Cccs("F1", "b", "0", "R1", 1)).Resistor("R2", "b", "0", 1e3).Build());
        Assert.Contains("'R1', which is no voltage source", e.Message);
    }

    [Fact]
    public void The_deck_writes_f_and_h_from_their_records()
    {
        var lines = new global::ThermVerify.Circuits.Spice.SpiceLines();
        foreach (var e in Sensing().Elements) e.WriteSpice(lines);
        Assert.Contains("Fcopy 0 out Vsense 2", lines.Netlist);
        Assert.Contains("Hm m 0 Vsense 500", lines.Netlist);
    }

    [NgspiceFact]
    public void Ngspice_gives_the_same_operating_point()
    {
        using var engine = new NgspiceEngine();
        string[] nodes = ["out", "m", "back"];
        var theirs = engine.TemperatureSweep(Sensing(), [25.0, 60.0], nodes);
        var ours = BuiltInEngine.Instance.TemperatureSweep(Sensing(), [25.0, 60.0], nodes);
        for (var n = 0; n < nodes.Length; n++)
            for (var i = 0; i < 2; i++)
                Tolerance.AssertClose(theirs[n][i], ours[n][i], 1e-9, 1e-12, $"V({nodes[n]})");
    }

    /// <summary>
    /// A sensor read by its current (an invented transimpedance readout): the NTC's current through a 0 V sense source, H
    /// turning it into 10 kΩ·I and F adding 1·I through the 1 kΩ output resistor: v(pin) = 11 kΩ·I = 11k·3.3/(10k + R).
    /// </summary>
    private const string Readout = """
        * sensor current read through H and F (invented scenario)
        Vexc exc 0 DC 3.3
        Rtop exc mid 10k
        Rntc mid sense 10k
        Vsense sense 0 DC 0
        Hread buf 0 Vsense 10k
        Rout buf pin 1k
        Fadd 0 pin Vsense 1
        Cres pin 0 100n
        .end
        """;

    private static FrontEndDesign ReadoutDesign()
    {
        var folder = Directory.CreateTempSubdirectory("tv-netlist-fh-");
        try
        {
            File.WriteAllText(Path.Combine(folder.FullName, "readout.cir"), Readout);
            File.WriteAllText(Path.Combine(folder.FullName, "readout.toml"), """
                name = "current readout"
                [sensor]
                model = "beta"
                r25 = "10 kohm"
                beta = 3435
                [netlist]
                file = "readout.cir"
                sensor = "Rntc"
                pin = "pin"
                reference = "exc"
                excitation = ["Vexc"]
                [adc]
                bits = 12
                reference = "ratiometric"
                sample_rate = "1 kHz"
                acquisition_time = "2 us"
                sampling_capacitance = "8 pF"
                switch_resistance = "1 kohm"
                pin_leakage = "20 nA"
                precharge = "last-sample"
                [check]
                range = "0 degC .. 70 degC"
                step = "5 K"
                budget = "1 K"
                """);
            return DesignLoader.Load(Path.Combine(folder.FullName, "readout.toml"));
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Fact]
    public void A_netlist_with_f_and_h_has_the_closed_form_worked_by_hand()
    {
        var transfer = NetlistTransfer.Of(ReadoutDesign().Netlist!);
        foreach (var r in new[] { 2e3, 10e3, 33e3 })
        {
            Tolerance.AssertClose(11e3 * 3.3 / (10e3 + r), transfer.OutputVolts(r), 1e-12, 0, $"v at {r} Ω");
            // H is a stiff source: the pin sees the 1 kΩ output resistor alone (F follows the sensor, not the pin).
            Tolerance.AssertClose(1e3, transfer.TheveninOhms(r), 1e-9, 0, $"resistance at the pin at {r} Ω");
        }
    }

    [NgspiceFact]
    public void Ngspice_gives_the_same_check_of_a_netlist_with_f_and_h()
    {
        var design = ReadoutDesign();
        var ours = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        using var engine = new NgspiceEngine();
        var theirs = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false, Engine = engine });
        Assert.Equal(ours.Passed, theirs.Passed);
        var lsb = ours.Adc.LsbVolts;
        for (var i = 0; i < ours.Points.Count; i++)
        {
            var (a, b) = (ours.Points[i], theirs.Points[i]);
            Tolerance.AssertClose(b.StaticPinVolts, a.StaticPinVolts, 0, 1e-6, $"static pin at {a.Celsius} °C");
            Tolerance.AssertClose(b.SampleVolts / lsb, a.SampleVolts / lsb, 0, 0.01, $"sample (LSB) at {a.Celsius} °C");
        }
    }
}
