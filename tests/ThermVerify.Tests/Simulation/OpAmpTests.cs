using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

public class OpAmpTests
{
    private const double Gbw = 1e6, A0 = 1e5;

    private static OpAmp Amp(string plus, string minus, string output) => new("U1", plus, minus, output)
    {
        OpenLoopGain = A0,
        GainBandwidthHertz = Gbw,
        OutputResistanceOhms = 50,
    };

    private static Circuit Follower(OpAmp amp, Waveform input, double acMagnitude = 0) => new CircuitBuilder()
        .VoltageSource("Vin", "in", "0", input, acMagnitude)
        .Add(amp)
        .Resistor("Rload", "out", "0", 1e6)
        .Build();

    [Fact]
    public void Follower_bandwidth_is_the_gain_bandwidth_product()
    {
        var ac = AcAnalysis.Run(Follower(Amp("in", "out", "out"), 0, 1), FrequencySweep.At(Gbw / 10, Gbw, 10 * Gbw));
        var h = ac.Transfer("out", "in");
        // Single-pole op-amp as follower: closed loop ≈ 1/(1 + jf/GBW), so −3.01 dB and −45° at f = GBW
        // (op-amp textbook result, from memory; A0 = 1e5 and the 50 Ω/1 MΩ divider shift it by < 0.001 dB).
        Tolerance.AssertClose(-3.0103, 20 * Math.Log10(h[1].Magnitude), 0, 0.01, "|H(GBW)| dB");
        Tolerance.AssertClose(-45, h[1].Phase * 180 / Math.PI, 0, 0.1, "∠H(GBW)");
        Tolerance.AssertClose(-20 * Math.Log10(Math.Sqrt(1.01)), 20 * Math.Log10(h[0].Magnitude), 0, 0.01, "|H(GBW/10)| dB");
    }

    [Fact]
    public void Follower_small_step_settles_with_time_constant_one_over_two_pi_gbw()
    {
        const double step = 0.01;
        var tau = 1 / (2 * Math.PI * Gbw);
        var circuit = Follower(Amp("in", "out", "out") with { OutputLowVolts = -5, OutputHighVolts = 5 }, new PulseWaveform(0, step, 0, 0, 0, 1, 0));
        double[] multiples = [0.5, 1, 2, 4, 8];
        var result = Transient.Run(circuit, new TransientOptions
        {
            StopTimeSeconds = 10 * tau,
            OutputTimesSeconds = [.. multiples.Select(m => m * tau)],
        });
        foreach (var m in multiples)
            // Single-pole closed loop: v(t) = ΔV·(1 − e^(−t/τ)), τ = 1/(2π·GBW) (op-amp textbook result, from memory);
            // tolerance 2e-4 of the step covers A0 = 1e5, r_o into 1 MΩ and the transient tolerance.
            Tolerance.AssertClose(step * (1 - Math.Exp(-m)), result.VoltageAt("out", m * tau), 0, 2e-4 * step, $"v at {m} τ");
    }

    [Fact]
    public void Large_step_slews_at_the_slew_rate()
    {
        const double slew = 1e6;
        var circuit = Follower(Amp("in", "out", "out") with { SlewRateVoltsPerSecond = slew, OutputLowVolts = -5, OutputHighVolts = 5 },
            new PulseWaveform(0, 1, 0, 0, 0, 1, 0));
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 3e-6 });
        var t = result.TimesSeconds;
        var v = result.Voltage("out");
        double Crossing(double level)
        {
            var i = Array.FindIndex(v, x => x >= level);
            return t[i - 1] + (level - v[i - 1]) * (t[i] - t[i - 1]) / (v[i] - v[i - 1]);
        }
        // Slew rate is the largest output slope (definition). Between 10 % and 40 % of the step the input stage
        // is deep in its limit (tanh(≥ 3.7) ≥ 0.999), so the slope is the slew rate within 1 %.
        var slope = 0.3 / (Crossing(0.4) - Crossing(0.1));
        Tolerance.AssertClose(slew, slope, 0.01);
        Tolerance.AssertClose(1, v[^1], 0, 1e-3, "settled value");
    }

    [Fact]
    public void Open_loop_output_clamps_at_each_swing_limit()
    {
        Circuit Comparator(double plus, double minus) => new CircuitBuilder()
            .VoltageSource("Vp", "p", "0", plus)
            .VoltageSource("Vm", "m", "0", minus)
            .Add(Amp("p", "m", "out") with { OutputLowVolts = 0.05, OutputHighVolts = 3.25 })
            .Resistor("Rload", "out", "0", 1e6)
            .Build();
        // Saturation at the swing limit (definition of the limit); the 1 MΩ load drops 50 Ω·I ≈ 0.16 mV at most.
        Tolerance.AssertClose(3.25 * 1e6 / (1e6 + 50), OperatingPoint.Solve(Comparator(1, 0)).Voltage("out"), 1e-6);
        Tolerance.AssertClose(0.05 * 1e6 / (1e6 + 50), OperatingPoint.Solve(Comparator(0, 1)).Voltage("out"), 1e-6);
    }

    [Fact]
    public void Offset_and_bias_currents_give_the_ohms_law_errors()
    {
        const double rs = 10e3, rf = 100e3, rg = 10e3, vos = 1e-3, ibp = 10e-9, ibm = 12e-9;
        var amp = new OpAmp("U1", "p", "m", "out")
        {
            OpenLoopGain = 1e9,
            GainBandwidthHertz = 1e6,
            InputOffsetVolts = vos,
            NonInvertingBiasAmperes = ibp,
            InvertingBiasAmperes = ibm,
        };
        var circuit = new CircuitBuilder()
            .VoltageSource("Vin", "in", "0", 0.1)
            .Resistor("Rs", "in", "p", rs)
            .Add(amp)
            .Resistor("Rf", "out", "m", rf)
            .Resistor("Rg", "m", "0", rg)
            .Build();
        var op = OperatingPoint.Solve(circuit);
        // Ideal-gain analysis by Ohm's and Kirchhoff's laws: V+ = Vin − Ib+·Rs, V− = V+ + Vos,
        // KCL at the inverting node: Vout = V−·(1 + Rf/Rg) + Ib−·Rf. A0 = 1e9 leaves ~1e-8 relative.
        var vPlus = 0.1 - ibp * rs;
        var expected = (vPlus + vos) * (1 + rf / rg) + ibm * rf;
        Tolerance.AssertClose(vPlus, op.Voltage("p"), 1e-9);
        Tolerance.AssertClose(expected, op.Voltage("out"), 1e-7);
    }

    [Fact]
    public void Input_outside_the_common_mode_range_is_a_warning_not_an_error()
    {
        var amp = Amp("in", "out", "out") with { CommonModeLowVolts = 0, CommonModeHighVolts = 2.0 };
        var inside = OperatingPoint.Solve(Follower(amp, 1.5));
        var outside = OperatingPoint.Solve(Follower(amp, 2.5));
        Assert.Empty(inside.Warnings);
        // A follower's inputs are both at 2.5 V: each pin is reported once.
        Assert.Equal(["in", "out"], outside.Warnings.Select(w => w.Subject).Order());
        Assert.All(outside.Warnings, w => Assert.Equal("U1", w.Element));
        var transient = Transient.Run(Follower(amp, new PulseWaveform(1, 2.5, 1e-6, 1e-7, 1e-7, 1, 0)), new TransientOptions { StopTimeSeconds = 3e-6 });
        Assert.Equal(2, transient.Warnings.Count);
        Assert.All(transient.Warnings, w => Assert.True(w.TimeSeconds > 1e-6, "first seen after the input rises"));
    }

    [Fact]
    public void Second_pole_adds_its_phase()
    {
        var amp = Amp("p", "0", "out") with { SecondPoleHertz = 5e6 };
        var circuit = new CircuitBuilder()
            .VoltageSource("Vp", "p", "0", 0, 1)
            .Add(amp)
            .Resistor("Rload", "out", "0", 1e6)
            .Build();
        var ac = AcAnalysis.Run(circuit, FrequencySweep.At(5e6));
        var h = ac.Voltage("out")[0];
        // Open loop A(f) = A0/((1 + jf·A0/GBW)(1 + jf/f2)) (definition of the model's poles), unloaded to 50 ppm.
        var expected = A0 / ((1 + new Complex(0, 5e6 * A0 / Gbw)) * (1 + new Complex(0, 1)));
        Tolerance.AssertClose(expected.Magnitude, h.Magnitude, 1e-4);
        Tolerance.AssertClose(expected.Phase, h.Phase, 0, 1e-4);
    }
}
