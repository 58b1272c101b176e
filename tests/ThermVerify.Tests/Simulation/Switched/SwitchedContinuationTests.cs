using ThermVerify.FrontEnd;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>
/// Exact propagation continued from the time-stepping engine's state (ExactSwitchedTransient.ReaderFrom): from a period
/// start, from inside an interval and from a switch edge, the later samples must be those of the exact run from t = 0,
/// within the time-stepping engine's own error at relative tolerance 1e-10 (below 1e-7 V on this circuit,
/// ExampleSamplingAgreementTests) plus the same margin.
/// </summary>
public class SwitchedContinuationTests
{
    [Theory]
    [InlineData(0.0)]     // a period start
    [InlineData(0.37)]    // inside the precharge interval
    [InlineData(0.9)]     // at the sampling switch's closing edge (t_acq = 2 µs of a 20 µs period)
    [InlineData(0.95)]    // inside the acquisition
    public void Continuation_from_a_stepped_state_reads_the_exact_samples(double phaseFraction)
    {
        var design = ExampleDesigns.Load("cold-storage-logger.toml");
        const int conversions = 6;
        var (circuit, options) = SamplingRun.Setup(design, -30, 0.0, 1e-6, conversions);
        var exact = ExactSwitchedTransient.Start(circuit);
        var fromStart = exact.SampleVoltages(FrontEndNodes.SamplingSwitch, conversions, FrontEndNodes.Hold);

        var start = (2 + phaseFraction) * exact.PeriodSeconds;
        var stepping = new TransientSimulation(circuit, options with { RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 });
        stepping.AdvanceTo(start);
        var read = exact.ReaderFrom(start, stepping.CaptureState().Solution);
        for (var k = 3; k < conversions; k++)
            Tolerance.AssertClose(fromStart[k], read(FrontEndCircuit.SampleTimeSeconds(design, k), FrontEndNodes.Hold), 0, 2e-7, $"conversion {k}");
        Assert.Throws<ArgumentOutOfRangeException>(() => read(start, FrontEndNodes.Hold));
    }
}
