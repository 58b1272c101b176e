using ThermVerify.Circuits;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Simulation;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Simulation;

/// <summary>The engine against ngspice (an independent engine) on the same circuits, run as a child process.</summary>
public class NgspiceCrossCheckTests
{
    [NgspiceFact]
    public void Temperature_sweep_of_an_ntc_divider_with_leakage_matches_ngspice()
    {
        const string deck = """
            ntc divider with filter and pin leakage
            .options tnom=25 numdgt=15 reltol=1e-12 abstol=1e-18 vntol=1e-15
            Vref ref 0 3.3
            Rtop ref ntc 10k
            RT1 ntc 0 r='10k*exp(3950*(1/(temper+273.15)-1/298.15))'
            Rf ntc adc 1k
            Cf adc 0 100n
            Bleak adc 0 I='50n*exp(0.6931471805599453*(temper-25)/10)'
            .dc temp -40 125.001 2.5
            .end
            """;
        var plot = NgspiceProcess.Run(deck).Plot("dc");
        var temperatures = plot["temp-sweep"].Real;
        var circuit = new CircuitBuilder()
            .VoltageSource("Vref", "ref", "0", 3.3)
            .Resistor("Rtop", "ref", "ntc", 10e3)
            .Add(new SensorResistor("RT1", "ntc", "0", new BetaThermistor(10e3, 3950)))
            .Resistor("Rf", "ntc", "adc", 1e3)
            .Capacitor("Cf", "adc", "0", 100e-9)
            .Add(new LeakageCurrentSource("Ileak", "adc", "0", 50e-9, 10))
            .Build();
        var sweep = DcSweep.Temperature(circuit, temperatures);
        var ours = sweep.Voltage("adc");
        var theirs = plot["adc"].Real;
        Assert.Equal(67, temperatures.Length);
        for (var i = 0; i < ours.Length; i++)
            // ngspice 39.3 with tight tolerances; both solve the same linear equations.
            Tolerance.AssertClose(theirs[i], ours[i], 1e-9, 1e-12, $"V(adc) at {temperatures[i]} °C");
    }

    [NgspiceFact]
    public void Sampling_transient_matches_ngspice_at_the_end_of_each_acquisition()
    {
        // 1 µs acquisitions every 100 µs (2 kΩ onto 8 pF), a 1 µs reset 6 µs later, 100 nF on a 10 kΩ/10 kΩ divider.
        // ngspice's switches follow PULSE controls with 1 ps edges; each acquisition's end is a PULSE corner,
        // hence an exact ngspice time point.
        const string deck = """
            sampling input
            .options reltol=1e-7 abstol=1e-16 vntol=1e-10 chgtol=1e-20 numdgt=15
            Vref ref 0 3.3
            R1 ref pin 10k
            R2 pin 0 10k
            Cext pin 0 100n
            Ssample pin hold cs 0 swm
            Vcs cs 0 pulse(0 1 10u 1p 1p 0.999999u 100u 3)
            Csample hold 0 8p
            Sreset hold 0 cr 0 swr
            Vcr cr 0 pulse(0 1 16u 1p 1p 0.999999u 100u 3)
            .model swm sw vt=0.5 vh=0 ron=2k roff=1e12
            .model swr sw vt=0.5 vh=0 ron=100 roff=1e12
            .tran 50n 300u
            .end
            """;
        var plot = NgspiceProcess.Run(deck).Plot("tran");
        var time = plot["time"].Real;
        var hold = plot["hold"].Real;
        var pin = plot["pin"].Real;
        var circuit = new CircuitBuilder()
            .VoltageSource("Vref", "ref", "0", 3.3)
            .Resistor("R1", "ref", "pin", 10e3)
            .Resistor("R2", "pin", "0", 10e3)
            .Capacitor("Cext", "pin", "0", 100e-9)
            .Switch("Ssample", "pin", "hold", 2e3, 1e12, new PeriodicSchedule(10e-6, 100e-6, 1e-6, 3))
            .Capacitor("Csample", "hold", "0", 8e-12)
            .Switch("Sreset", "hold", "0", 100, 1e12, new PeriodicSchedule(16e-6, 100e-6, 1e-6, 3))
            .Build();
        double[] ends = [11e-6, 111e-6, 211e-6];
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 300e-6, OutputTimesSeconds = ends });
        foreach (var t in ends)
        {
            var i = Array.FindIndex(time, x => Math.Abs(x - t) < 1e-15);
            Assert.True(i >= 0, $"ngspice has a point at {t}");
            // Agreement within 2e-6 V (0.003 LSB of 12 bits at 3.3 V): ngspice's own tolerances and its switch
            // closing half a picosecond later bound the difference.
            Tolerance.AssertClose(hold[i], result.VoltageAt("hold", t), 0, 2e-6, $"V(hold) at {t * 1e6} µs");
            Tolerance.AssertClose(pin[i], result.VoltageAt("pin", t), 0, 2e-6, $"V(pin) at {t * 1e6} µs");
        }
    }
}
