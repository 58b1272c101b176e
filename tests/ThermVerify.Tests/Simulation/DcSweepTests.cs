using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

public class DcSweepTests
{
    private const double Rel = 1e-9;

    private static double[] Range(double from, double to, double step) =>
        [.. Enumerable.Range(0, (int)Math.Round((to - from) / step) + 1).Select(i => from + i * step)];

    [Fact]
    public void Sensor_divider_follows_the_closed_form_over_temperature()
    {
        var sensor = new ClosedFormBetaSensor(10e3, 3950);
        var circuit = new CircuitBuilder()
            .VoltageSource("Vref", "ref", "0", 3.3)
            .Resistor("Rtop", "ref", "adc", 10e3)
            .Add(new SensorResistor("RT", "adc", "0", sensor))
            .Build();
        var temperatures = Range(-40, 125, 0.5);
        var sweep = DcSweep.Temperature(circuit, temperatures);
        var v = sweep.Voltage("adc");
        for (var i = 0; i < temperatures.Length; i++)
        {
            // Divider closed form: V = Vref·R_T/(R_top + R_T), with the Beta model written out.
            var rt = 10e3 * Math.Exp(3950 * (1 / (temperatures[i] + 273.15) - 1 / 298.15));
            Tolerance.AssertClose(3.3 * rt / (10e3 + rt), v[i], Rel, 0, $"V(adc) at {temperatures[i]} °C");
        }
    }

    [Fact]
    public void Tempco_resistor_follows_quadratic_coefficients()
    {
        const double tc1 = 3.9e-3, tc2 = -6e-7;
        var circuit = new CircuitBuilder()
            .CurrentSource("I1", "0", "x", 1e-3)
            .Add(new Resistor("R1", "x", "0", 100, tc1, tc2))
            .Build();
        var temperatures = Range(-50, 150, 10);
        var v = DcSweep.Temperature(circuit, temperatures).Voltage("x");
        for (var i = 0; i < temperatures.Length; i++)
        {
            // R(T) = R·(1 + tc1·ΔT + tc2·ΔT²) (SPICE resistor temperature model, from memory); V = I·R.
            var dt = temperatures[i] - 25;
            Tolerance.AssertClose(1e-3 * 100 * (1 + tc1 * dt + tc2 * dt * dt), v[i], Rel);
        }
    }

    [Fact]
    public void Pin_leakage_doubles_every_n_kelvin_and_drops_across_the_source_resistance()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1.0)
            .Resistor("Rs", "in", "pin", 47e3)
            .Add(new LeakageCurrentSource("Ileak", "pin", "0", 5e-9, 10))
            .Build();
        var temperatures = Range(-40, 125, 5);
        var sweep = DcSweep.Temperature(circuit, temperatures);
        var v = sweep.Voltage("pin");
        var i = sweep.Current("Ileak");
        for (var k = 0; k < temperatures.Length; k++)
        {
            // I = I25·2^((T−25)/N) (common practice, no source); error by Ohm's law: ΔV = −I·Rs.
            var leak = 5e-9 * Math.Pow(2, (temperatures[k] - 25) / 10);
            Tolerance.AssertClose(leak, i[k], Rel);
            Tolerance.AssertClose(1.0 - leak * 47e3, v[k], Rel);
        }
    }

    [Fact]
    public void Source_and_resistor_sweeps_follow_ohms_law()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1)
            .Resistor("R1", "in", "out", 1e3)
            .Resistor("R2", "out", "0", 1e3)
            .Build();
        var volts = Range(-2, 2, 0.25);
        var byVolts = DcSweep.Element(circuit, "V1", volts).Voltage("out");
        var ohms = Range(100, 10000, 100);
        var byOhms = DcSweep.Element(circuit, "R2", ohms).Voltage("out");
        // Ohm's law for a divider.
        for (var i = 0; i < volts.Length; i++)
            Tolerance.AssertClose(volts[i] / 2, byVolts[i], Rel, 1e-15);
        for (var i = 0; i < ohms.Length; i++)
            Tolerance.AssertClose(ohms[i] / (1e3 + ohms[i]), byOhms[i], Rel);
    }

    [Fact]
    public void Sweeping_a_capacitor_is_refused_with_a_clear_message()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1)
            .Resistor("R1", "in", "out", 1e3)
            .Capacitor("C1", "out", "0", 1e-9)
            .Build();
        var e = Assert.Throws<CircuitException>(() => DcSweep.Element(circuit, "C1", [1e-9]));
        Assert.Contains("C1", e.Message);
    }

    [Fact]
    public void Same_circuit_at_another_temperature_by_with()
    {
        var sensor = new ClosedFormBetaSensor(10e3, 3950);
        var circuit = new CircuitBuilder()
            .VoltageSource("Vref", "ref", "0", 3.3)
            .Resistor("Rtop", "ref", "adc", 10e3)
            .Add(new SensorResistor("RT", "adc", "0", sensor))
            .Build();
        var hot = OperatingPoint.Solve(circuit with { TemperatureCelsius = 80 }).Voltage("adc");
        var swept = DcSweep.Temperature(circuit, [80.0]).Voltage("adc")[0];
        var rt = sensor.ResistanceOhms(80);
        // Divider closed form at 80 °C; the operating point and the sweep agree with it.
        Tolerance.AssertClose(3.3 * rt / (10e3 + rt), hot, Rel);
        Tolerance.AssertClose(hot, swept, 1e-14);
    }
}
