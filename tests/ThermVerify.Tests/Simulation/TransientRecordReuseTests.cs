using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>
/// A run read in chunks drops its recorded points after each chunk, and the record's arrays are reused for the next
/// chunk unless a result holds them: neither may change what the run computes or what a result already handed out
/// shows.
/// </summary>
public class TransientRecordReuseTests
{
    private const double R = 10e3, C = 1e-9, Tau = R * C;

    private static TransientSimulation Run() => new(new CircuitBuilder()
        .VoltageSource("V1", "in", "0", new PulseWaveform(0, 1, 0, 0, 0, 1, 0))
        .Resistor("R1", "in", "out", R)
        .Capacitor("C1", "out", "0", C)
        .Build(), new TransientOptions { StopTimeSeconds = 10 * Tau, MaxStepSeconds = Tau / 20 });

    [Fact]
    public void Chunks_with_forgotten_points_give_the_same_voltages_as_one_run()
    {
        var whole = Run();
        var chunked = Run();
        for (var k = 1; k <= 40; k++)
        {
            var t = k * Tau / 4;
            whole.AdvanceTo(t);
            chunked.AdvanceTo(t);
            chunked.ForgetRecordedPoints();
            Assert.Equal(whole.Voltage("out"), chunked.Voltage("out"));
            // RC charging, v = 1 − e^(−t/τ) (first-order ODE solution), at the engine's default tolerance.
            Tolerance.AssertClose(1 - Math.Exp(-t / Tau), chunked.Voltage("out"), 0, 3e-5, $"v at {t / Tau:F2} τ");
        }
    }

    [Fact]
    public void A_result_handed_out_keeps_its_points_when_the_run_goes_on()
    {
        var run = Run();
        run.AdvanceTo(2 * Tau);
        var early = run.Result;
        var times = early.TimesSeconds.ToArray();
        var volts = early.Voltage("out").ToArray();
        run.ForgetRecordedPoints();
        run.AdvanceTo(6 * Tau);
        run.ForgetRecordedPoints();
        run.AdvanceTo(9 * Tau);
        Assert.Equal(times, early.TimesSeconds);
        Assert.Equal(volts, early.Voltage("out"));
    }
}
