using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Circuits;

/// <summary>Bad circuits give the documented exception naming the culprit (rule of the engine's design, no outside source).</summary>
public class TopologyTests
{
    [Fact]
    public void Floating_node_is_named()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1)
            .Resistor("R1", "in", "0", 1e3)
            .Resistor("R2", "in", "dangling", 1e3)
            .Build();
        var e = Assert.Throws<TopologyException>(() => OperatingPoint.Solve(circuit));
        Assert.Equal(["dangling"], e.Nodes);
        Assert.Equal(["R2"], e.Elements);
    }

    [Fact]
    public void Voltage_source_loop_names_every_element_in_it()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "a", "0", 1)
            .VoltageSource("V2", "a", "b", 0.5)
            .Inductor("L1", "b", "0", 1e-6)
            .Resistor("R1", "a", "0", 1e3)
            .Build();
        var e = Assert.Throws<TopologyException>(() => OperatingPoint.Solve(circuit));
        Assert.Equal(["L1", "V1", "V2"], e.Elements.Order());
    }

    [Fact]
    public void Node_reached_only_through_capacitors_has_no_dc_path()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1)
            .Resistor("R1", "in", "0", 1e3)
            .Capacitor("C1", "in", "mid", 1e-9)
            .Capacitor("C2", "mid", "0", 1e-9)
            .Build();
        var e = Assert.Throws<TopologyException>(() => OperatingPoint.Solve(circuit));
        Assert.Equal(["mid"], e.Nodes);
        Assert.Contains("C1", e.Elements);
    }

    [Fact]
    public void Missing_ground_is_reported()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "a", "b", 1)
            .Resistor("R1", "a", "b", 1e3)
            .Build();
        Assert.Throws<TopologyException>(() => OperatingPoint.Solve(circuit));
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-10.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Bad_resistance_names_the_resistor(double ohms)
    {
        var e = Assert.Throws<CircuitException>(() => new CircuitBuilder().Resistor("Rbad", "a", "0", ohms).Build());
        Assert.Contains("Rbad", e.Message);
    }

    [Fact]
    public void Nan_source_value_and_bad_capacitance_are_rejected()
    {
        Assert.Contains("V9", Assert.Throws<CircuitException>(() => new CircuitBuilder().VoltageSource("V9", "a", "0", double.NaN).Build()).Message);
        Assert.Contains("C9", Assert.Throws<CircuitException>(() => new CircuitBuilder().Capacitor("C9", "a", "0", -1e-9).Build()).Message);
    }

    [Fact]
    public void Duplicate_names_and_shorted_elements_are_rejected()
    {
        Assert.Throws<CircuitException>(() => new CircuitBuilder().Resistor("R1", "a", "0", 1).Resistor("R1", "a", "0", 2).Build());
        Assert.Throws<CircuitException>(() => new CircuitBuilder().Resistor("R1", "a", "a", 1).Build());
    }

    [Fact]
    public void Tempco_that_drives_resistance_negative_is_reported_at_that_temperature()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "a", "0", 1)
            .Add(new Resistor("Rt", "a", "0", 100, Tc1PerKelvin: -0.02))
            .Build();
        var e = Assert.Throws<CircuitException>(() => DcSweep.Temperature(circuit, [25.0, 100.0]));
        Assert.Contains("Rt", e.Message);
    }

    [Fact]
    public void Temperature_below_absolute_zero_is_rejected()
    {
        var circuit = new CircuitBuilder().VoltageSource("V1", "a", "0", 1).Resistor("R1", "a", "0", 1).Build();
        Assert.Throws<CircuitException>(() => circuit with { TemperatureCelsius = -300 });
    }
}
