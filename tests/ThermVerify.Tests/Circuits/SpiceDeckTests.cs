using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Simulation;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Circuits;

/// <summary>
/// Circuits written by <see cref="SpiceDeckWriter"/> and run in ngspice (an independent engine, child process)
/// agree with the engine on the same circuit.
/// </summary>
public class SpiceDeckTests
{

    [NgspiceFact]
    public void Temperature_sweep_with_beta_ntc_rtd_tempco_and_leakage_matches_ngspice()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("Vref", "ref", "0", 3.3)
            .Add(new Resistor("Rtop", "ref", "ntc", 10e3, 50e-6, 1e-8))
            .Add(new SensorResistor("RT1", "ntc", "0", new BetaThermistor(10e3, 3950)))
            .Resistor("Rf", "ntc", "adc", 1e3)
            .Capacitor("Cf", "adc", "0", 100e-9)
            .Add(new LeakageCurrentSource("Ileak", "adc", "0", 50e-9, 10))
            .Resistor("Rrtd", "ref", "rtd", 1e3)
            .Add(new SensorResistor("PT1", "rtd", "0", new PlatinumRtd(100)))
            .Build();
        var plot = NgspiceProcess.Run(SpiceDeckWriter.Write(circuit, new DcTemperatureSweep(-50, 5, 41))).Plot("dc");
        var temperatures = plot["temp-sweep"].Real;
        Assert.Equal(41, temperatures.Length);
        var sweep = DcSweep.Temperature(circuit, temperatures);
        foreach (var node in new[] { "adc", "rtd" })
        {
            var ours = sweep.Voltage(node);
            var theirs = plot[node].Real;
            for (var i = 0; i < ours.Length; i++)
                // ngspice 39.3 on the written deck (tempco, Beta and Callendar–Van Dusen as expressions of temper).
                Tolerance.AssertClose(theirs[i], ours[i], 1e-9, 1e-12, $"V({node}) at {temperatures[i]} °C");
        }
    }

    [NgspiceFact]
    public void Diode_clamp_operating_point_matches_ngspice()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("Vdd", "vdd", "0", 3.3)
            .VoltageSource("Vin", "in", "0", 5)
            .Resistor("Rs", "in", "pin", 4.7e3)
            .Add(new Diode("Dhi", "pin", "vdd", 2e-14, 1.05, 3))
            .Add(new Diode("Dlo", "0", "pin", 2e-14, 1.05, 3) { SaturationReferenceCelsius = 25 })
            .Resistor("Rl", "pin", "0", 100e3)
            .At(60)
            .Build();
        var plot = NgspiceProcess.Run(SpiceDeckWriter.Write(circuit, new OperatingPointAnalysis())).Plot("op");
        var op = OperatingPoint.Solve(circuit);
        // ngspice 39.3: same Shockley model, series resistance, gmin and (for Dlo) the SPICE temperature law.
        // Tolerance: ngspice's k and q are CODATA 2014 values; its kT/q differs from the exact SI one by 3.7e-7.
        Tolerance.AssertClose(plot["pin"].Real[0], op.Voltage("pin"), 1e-6);
    }

    [NgspiceFact]
    public void Op_amp_follower_with_capacitive_load_ac_response_matches_ngspice()
    {
        var amp = new OpAmp("U1", "in", "out", "out")
        {
            OpenLoopGain = 2e5, GainBandwidthHertz = 3e6, SecondPoleHertz = 20e6, OutputResistanceOhms = 80,
            OutputLowVolts = 0.05, OutputHighVolts = 3.25, InputOffsetVolts = 1e-3,
        };
        var circuit = new CircuitBuilder()
            .VoltageSource("Vin", "in", "0", 1.2, 1)
            .Add(amp)
            .Capacitor("CL", "out", "0", 2.2e-9)
            .Resistor("RL", "out", "0", 10e3)
            .Build();
        var plot = NgspiceProcess.Run(SpiceDeckWriter.Write(circuit, new AcSweep(10, 100e6, 5))).Plot("ac");
        var frequencies = plot["frequency"].Complex!.Select(f => f.Real).ToArray();
        var ac = AcAnalysis.Run(circuit, FrequencySweep.At(frequencies));
        var ours = ac.Voltage("out");
        var theirs = plot["out"].Complex!;
        for (var k = 0; k < ours.Length; k++)
            // ngspice 39.3 on the written macro-model, linearised at the same operating point.
            Tolerance.AssertClose(0, Complex.Abs(ours[k] - theirs[k]), 0, 1e-7 * Math.Max(1, theirs[k].Magnitude), $"V(out) at {frequencies[k]:G4} Hz");
    }

    [NgspiceFact]
    public void Sampling_transient_written_as_a_deck_matches_ngspice()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("Vref", "ref", "0", 3.3)
            .Resistor("R1", "ref", "pin", 10e3)
            .Resistor("R2", "pin", "0", 10e3)
            .Capacitor("Cext", "pin", "0", 100e-9)
            .Switch("Ssample", "pin", "hold", 2e3, 1e12, new PeriodicSchedule(10e-6, 100e-6, 1e-6, 3))
            .Capacitor("Csample", "hold", "0", 8e-12)
            .Switch("Sreset", "hold", "0", 100, 1e12, new IntervalSchedule((16e-6, 17e-6), (116e-6, 117e-6)))
            .Build();
        var deck = SpiceDeckWriter.Write(circuit, new TransientSweep(300e-6, 50e-9)
        {
            RelativeTolerance = 1e-7, VoltageToleranceVolts = 1e-10, StepGuards = StepGuard.ForSwitches(circuit),
        });
        var plot = NgspiceProcess.Run(deck).Plot("tran");
        var time = plot["time"].Real;
        double[] ends = [11e-6, 111e-6, 211e-6];
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 300e-6, OutputTimesSeconds = ends });
        foreach (var t in ends)
        {
            var i = Array.FindIndex(time, x => Math.Abs(x - t) < 1e-15);
            Assert.True(i >= 0, $"ngspice has a point at {t}");
            // ngspice's switches close half a picosecond later; its tolerances bound the rest (2e-6 V ≈ 0.003 LSB of 12 bits).
            Tolerance.AssertClose(plot["hold"].Real[i], result.VoltageAt("hold", t), 0, 2e-6, $"V(hold) at {t * 1e6} µs");
        }
    }

    [NgspiceFact]
    public void Rc_output_noise_matches_ngspice()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 0, 1)
            .Resistor("R1", "in", "out", 47e3)
            .Capacitor("C1", "out", "0", 1e-9)
            .Resistor("R2", "out", "0", 100e3)
            .At(70)
            .Build();
        var plot = NgspiceProcess.Run(SpiceDeckWriter.Write(circuit, new NoiseSweep("out", "V1", 10, 1e6, 5))).Plot("noise");
        var frequencies = plot["frequency"].Real;
        var noise = NoiseAnalysis.Run(circuit, "out", FrequencySweep.At(frequencies));
        var ours = noise.OutputDensity;
        var theirs = plot["onoise_spectrum"].Real;
        for (var k = 0; k < ours.Length; k++)
            // ngspice 39.3 resistor thermal noise at .temp 70 (its k may differ from the exact SI value in the 7th digit).
            Tolerance.AssertClose(theirs[k], ours[k], 1e-5, 0, $"output noise at {frequencies[k]:G4} Hz");
    }
}
