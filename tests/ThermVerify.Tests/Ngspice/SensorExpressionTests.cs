using ThermVerify.Ngspice;
using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// Each sensor model's SPICE expression, swept by ngspice's <c>.dc temp</c> (the reference engine), against the
/// model's own R(T): 1 A through the sensor makes v(n) = R. Agreement to 1e-9 relative shows the expression is the
/// same curve (Beta: its defining formula; Steinhart–Hart: the cubic's closed-form root, from the encyclopedia article
/// "Steinhart–Hart equation"; RTD: IEC 60751; table: the same monotone cubic).
/// </summary>
public class SensorExpressionTests
{
    public static TheoryData<string> Models() => ["beta", "steinhart-hart", "steinhart-hart-d", "rtd", "table"];

    private static ISensorModel Build(string name) => name switch
    {
        "beta" => new BetaThermistor(10e3, 3950),
        // Coefficients of a 10 kΩ NTC (from memory, typical magnitudes; any monotone set will do).
        "steinhart-hart" => new SteinhartHartThermistor(1.129148e-3, 2.34125e-4, 8.76741e-8),
        "steinhart-hart-d" => new SteinhartHartThermistor(1.129148e-3, 2.34125e-4, 8.76741e-8, 1e-7),
        "rtd" => new PlatinumRtd(1000),
        _ => TableThermistor.Parse(File.ReadAllText(Path.Combine(ExampleDesigns.Folder(), "table-47k-rt.csv")), "table-47k-rt.csv"),
    };

    [NgspiceTheory]
    [MemberData(nameof(Models))]
    public void Ngspice_sweeps_the_same_resistance_as_the_model(string name)
    {
        var sensor = Build(name);
        var (lo, hi) = (Math.Max(sensor.ValidRange.MinCelsius, -50), Math.Min(sensor.ValidRange.MaxCelsius, 150));
        var step = (hi - lo) / 40;
        var temperatures = Enumerable.Range(0, 41).Select(i => lo + i * step).ToArray();
        var circuit = new Circuit([new CurrentSource("I1", "0", "n", new DcWaveform(1)), new SensorResistor("Rs", "n", "0", sensor)]);
        var plot = NgspiceSession.Run(SpiceDeckWriter.Write(circuit, DcTemperatureSweep.From(temperatures))).Plot("dc");
        var swept = plot["temp-sweep"].Real;
        var volts = plot["n"].Real;
        for (var i = 0; i < temperatures.Length; i++)
            Tolerance.AssertClose(sensor.ResistanceOhms(swept[i]), volts[i], 1e-9, 0, $"{name} at {swept[i]} °C");
    }
}
