using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>
/// A node that follows a source's ramp exactly (no capacitor, no jump at the corner), read between the time points
/// (distilled from differential seed 128, a 43 ps PULSE edge on a ns run). The probe step after a breakpoint was at
/// least 1 ps long, and inside it the interpolant gave the value after the step, as it must after a switch edge: at a
/// source corner that is the ramp 1 ps later, 0.08 V off on seed 128.
/// </summary>
public class SourceCornerTests
{
    [Theory]
    [InlineData(0.25e-12)]
    [InlineData(0.5e-12)]
    [InlineData(0.9e-12)]
    [InlineData(3e-12)]
    public void A_node_on_a_ramping_source_reads_the_ramp_just_after_its_corner(double afterCornerSeconds)
    {
        // Closed form: V(t) = (t − td)/tr volts on the ramp (SPICE PULSE from 0 to 1 V), the divider halves it.
        const double delay = 3e-10, rise = 4e-11;
        var circuit = new Circuit(
        [
            new VoltageSource("V1", "in", "0", new PulseWaveform(0, 1, delay, rise, rise, 3e-10, 0)),
            new Resistor("R1", "in", "out", 1e3),
            new Resistor("R2", "out", "0", 1e3),
        ]);
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 1e-9, MaxStepSeconds = 1e-11 });
        var t = delay + afterCornerSeconds;
        Tolerance.AssertClose(0.5 * afterCornerSeconds / rise, result.VoltageAt("out", t), 0, 1e-9);
    }
}
