using ThermVerify.Simulation;
using ThermVerify.Circuits;

namespace ThermVerify.Tests.Simulation;

public class LoopGainTests
{
    [Theory]
    [InlineData(10e-9)]
    [InlineData(1e-9)]
    [InlineData(100e-12)]
    public void Follower_with_capacitive_load_has_the_single_pole_phase_margin(double loadFarads)
    {
        const double gbw = 1e6, ro = 100;
        var amp = new OpAmp("U1", "in", "out", "out") { OpenLoopGain = 1e5, GainBandwidthHertz = gbw, OutputResistanceOhms = ro };
        var circuit = new CircuitBuilder()
            .VoltageSource("Vin", "in", "0", 1)
            .Add(amp)
            .Capacitor("CL", "out", "0", loadFarads)
            .Resistor("Rbias", "out", "0", 1e9)
            .Build();
        var result = LoopGain.Run(circuit, "U1", FrequencySweep.Logarithmic(1, 1e9, 20));

        // Single-pole loop gain with the output pole: T(f) = (GBW/jf)·1/(1 + jf/fp), fp = 1/(2π·r_o·C_L);
        // crossover from |T| = 1: fc² = fp²/2·(√(1 + 4·GBW²/fp²) − 1); PM = 90° − atan(fc/fp)
        // (op-amp textbook result, from memory). The 1 GΩ keeps a DC path and adds < 1e-7 of loading.
        var fp = 1 / (2 * Math.PI * ro * loadFarads);
        var fc = fp * Math.Sqrt((Math.Sqrt(1 + 4 * gbw * gbw / (fp * fp)) - 1) / 2);
        var pm = 90 - Math.Atan(fc / fp) * 180 / Math.PI;
        Assert.NotNull(result.PhaseMarginDegrees);
        Tolerance.AssertClose(pm, result.PhaseMarginDegrees!.Value, 0, 1.0, "phase margin (°)");
        Tolerance.AssertClose(fc, result.CrossoverHertz!.Value, 0.01, 0, "crossover (Hz)");
        // At 1 Hz the loop gain is A0·β/|1 + jf·A0/GBW| with β = 1 (dominant pole at GBW/A0 = 10 Hz).
        Tolerance.AssertClose(1e5 / Math.Sqrt(1 + 0.01), result.Gain[0].Magnitude, 1e-6);
    }

    [Fact]
    public void Non_inverting_amplifier_loop_gain_is_a_times_beta()
    {
        const double rf = 90e3, rg = 10e3;
        var amp = new OpAmp("U1", "in", "m", "out") { OpenLoopGain = 1e5, GainBandwidthHertz = 1e6, OutputResistanceOhms = 1e-3 };
        var circuit = new CircuitBuilder()
            .VoltageSource("Vin", "in", "0", 0.1)
            .Add(amp)
            .Resistor("Rf", "out", "m", rf)
            .Resistor("Rg", "m", "0", rg)
            .Build();
        var result = LoopGain.Run(circuit, "U1", FrequencySweep.Logarithmic(1, 1e7, 10));
        // Feedback factor β = Rg/(Rf + Rg) = 0.1, so T(0) = A0·β and the crossover is near β·GBW (textbook, from memory).
        Tolerance.AssertClose(1e5 * 0.1 / Math.Sqrt(1 + 0.01), result.Gain[0].Magnitude, 1e-6);
        Tolerance.AssertClose(0.1e6, result.CrossoverHertz!.Value, 1e-3);
        Tolerance.AssertClose(90, result.PhaseMarginDegrees!.Value, 0, 0.1);
    }
}
