using ThermVerify.Circuits;
using ThermVerify.Sensors;

namespace ThermVerify.Benchmarks;

/// <summary>The invented front ends the benchmarks run (own scenarios, not a product's).</summary>
internal static class FrontEnds
{
    /// <summary>3.3 V over 10 kΩ into a 10 kΩ β = 3950 NTC, 1 kΩ + 100 nF filter, 50 nA pin leakage doubling every 10 K.</summary>
    public static Circuit NtcDivider() => new CircuitBuilder()
        .VoltageSource("Vref", "ref", "0", 3.3)
        .Resistor("Rtop", "ref", "ntc", 10e3)
        .Add(new SensorResistor("RT1", "ntc", "0", new BetaThermistor(10e3, 3950)))
        .Resistor("Rf", "ntc", "adc", 1e3)
        .Capacitor("Cf", "adc", "0", 100e-9)
        .Add(new LeakageCurrentSource("Ileak", "adc", "0", 50e-9, 10))
        .Build();

    public static double[] Temperatures()
    {
        var t = new double[1651];
        for (var i = 0; i < t.Length; i++)
            t[i] = -40 + 0.1 * i;
        return t;
    }

    public const double SamplePeriodSeconds = 100e-6;
    public const double AcquisitionSeconds = 1e-6;
    public const int Conversions = 64;

    /// <summary>
    /// 10 kΩ/10 kΩ divider from 3.3 V with a 100 nF reservoir on the pin; every 100 µs the 2 kΩ sampling
    /// switch closes for 1 µs onto 8 pF, which a reset switch empties 5 µs later (the conversion's end).
    /// </summary>
    public static Circuit SamplingInput() => new CircuitBuilder()
        .VoltageSource("Vref", "ref", "0", 3.3)
        .Resistor("R1", "ref", "pin", 10e3)
        .Resistor("R2", "pin", "0", 10e3)
        .Capacitor("Cext", "pin", "0", 100e-9)
        .Switch("Ssample", "pin", "hold", 2e3, 1e12, new PeriodicSchedule(10e-6, SamplePeriodSeconds, AcquisitionSeconds, Conversions))
        .Capacitor("Csample", "hold", "0", 8e-12)
        .Switch("Sreset", "hold", "0", 100, 1e12, new PeriodicSchedule(16e-6, SamplePeriodSeconds, 1e-6, Conversions))
        .Build();

    public static double[] AcquisitionEnds() =>
        [.. Enumerable.Range(0, Conversions).Select(k => 10e-6 + k * SamplePeriodSeconds + AcquisitionSeconds)];
}
