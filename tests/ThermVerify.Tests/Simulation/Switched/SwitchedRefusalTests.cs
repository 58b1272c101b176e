using ThermVerify.Circuits;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>What exact propagation refuses, and that the refusal names the element and the way round it.</summary>
public class SwitchedRefusalTests
{
    private static CircuitBuilder Base() => new CircuitBuilder()
        .VoltageSource("V1", "src", "0", 1.0)
        .Resistor("R1", "src", "pin", 10e3)
        .Capacitor("C1", "pin", "0", 1e-9);

    private static readonly PeriodicSchedule Every10Us = new(1e-6, 10e-6, 1e-6);

    public static TheoryData<string, string> Cases() => new()
    {
        { "diode", "D1" },
        { "pulse", "Vpulse" },
        { "intervals", "S1" },
        { "two periods", "S2" },
        { "no switch", "" },
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Refuses_with_the_element_named(string what, string element)
    {
        var b = Base();
        b = what switch
        {
            "diode" => b.Add(new Diode("D1", "pin", "0")).Switch("S1", "pin", "h", 1e3, 1e12, Every10Us).Capacitor("Ch", "h", "0", 1e-12),
            "pulse" => b.VoltageSource("Vpulse", "p", "0", new PulseWaveform(0, 1, 1e-6, 1e-9, 1e-9, 1e-6, 0)).Resistor("Rp", "p", "pin", 1e3)
                .Switch("S1", "pin", "h", 1e3, 1e12, Every10Us).Capacitor("Ch", "h", "0", 1e-12),
            "intervals" => b.Switch("S1", "pin", "h", 1e3, 1e12, new IntervalSchedule((1e-6, 2e-6))).Capacitor("Ch", "h", "0", 1e-12),
            "two periods" => b.Switch("S1", "pin", "h", 1e3, 1e12, Every10Us).Capacitor("Ch", "h", "0", 1e-12)
                .Switch("S2", "h", "0", 1e3, 1e12, new PeriodicSchedule(5e-6, 20e-6, 1e-6)),
            _ => b,
        };
        Assert.False(ExactSwitchedTransient.TryStart(b.Build(), out _, out var reason));
        Assert.Null(reason.Violation);
        Assert.Contains("TransientSimulation", reason.Message);
        if (element != "")
        {
            Assert.Equal(element, reason.Element);
            Assert.Contains($"'{element}'", reason.Message);
        }
    }
}
