using System.Numerics;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// The built-in engine against ngspice (the trade's reference engine, run on the decks thermverify writes) for every
/// example design: temperature sweep within 1 µV, sampled values within 0.01 LSB, AC within 0.01 dB and 0.1°, noise
/// density within 1 %. The limits are the acceptance figures.
/// </summary>
public class EngineCrossCheckTests
{
    private const double SweepVolts = 1e-6;
    private const double SampleLsb = 0.01;

    private static readonly Lazy<NgspiceEngine> Ngspice = new(() => new NgspiceEngine());

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Temperature_sweep_agrees_within_a_microvolt(string file)
    {
        var design = ExampleDesigns.Load(file);
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var model = new ClosedFormModel(design);
        // The decks the check's temperature sweeps run: the whole circuit, the buffer alone (no pin leakage, no fixed
        // tempco), and the circuit with each precharge case's average sampling current.
        var circuits = new List<(string What, ThermVerify.Circuits.Circuit Circuit)> { ("whole circuit", FrontEndCircuit.Dc(design, null)) };
        if (design.Buffer is not null) circuits.Add(("buffer alone", FrontEndCircuit.Dc(DcLevels.WithoutLoading(design), null)));
        foreach (var c in PrechargeCases.For(design, model.Adc.ReferenceVolts).Where(c => DcLevels.UsesAverageSamplingCurrent(design, c.Volts)))
            circuits.Add(($"with the sampling current, {c.Describe()}", FrontEndCircuit.Dc(design, c.Volts)));
        // A netlist has its own nodes: its pin.
        string[] nodes = design.Netlist is null ? [FrontEndNodes.Divider, FrontEndCircuit.PinNode(design)] : [FrontEndCircuit.PinNode(design)];
        foreach (var (what, circuit) in circuits)
        {
            var ours = ((ICheckEngine)BuiltInEngine.Instance).TemperatureSweep(circuit, temperatures, nodes);
            var theirs = ((ICheckEngine)Ngspice.Value).TemperatureSweep(circuit, temperatures, nodes);
            for (var i = 0; i < temperatures.Length; i++)
                for (var n = 0; n < nodes.Length; n++)
                    Tolerance.AssertClose(theirs[n][i], ours[n][i], 0, ExampleDesigns.DiodeLawSlackLsb(design) * model.Adc.LsbVolts ?? SweepVolts, $"{nodes[n]}, {what}, {file} at {temperatures[i]} °C");
        }
    }

    /// <summary>
    /// The first <see cref="Conversions"/> conversions of the check's own sampling circuit, at both ends of the check
    /// range and for every precharge case; each sample is v(hold) when the sampling switch opens.
    /// </summary>
    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Sampled_values_agree_within_a_hundredth_of_an_lsb(string file)
    {
        var design = ExampleDesigns.Load(file);
        var model = new ClosedFormModel(design);
        var lsb = model.Adc.LsbVolts;
        var settleVolts = design.Check.SettleLimitLsb * lsb;
        var range = design.Check.Range;
        // A design that states no precharge is checked for every case ("worst"); ngspice stops with "timestep too small"
        // at the sampling switch of the precharged oven and soil-probe transients (a limit of that engine's step control,
        // not a disagreement), so those designs are compared holding the last sample, as before "worst" was the default.
        var cases = design.Adc.Precharge == PrechargeMode.Worst ? [PrechargeCase.LastSample] : PrechargeCases.For(design, model.Adc.ReferenceVolts);
        foreach (var pre in cases.Select(c => c.Volts))
            foreach (var celsius in new[] { range.MinCelsius, range.MaxCelsius })
            {
                var (circuit, options) = SamplingRun.Setup(design, celsius, pre, settleVolts, Conversions);
                var ours = BuiltInEngine.Instance.StartTransient(circuit, options);
                var theirs = Ngspice.Value.StartTransient(circuit, options);
                for (var k = 0; k < Conversions; k++)
                {
                    var t = FrontEndCircuit.SampleTimeSeconds(design, k);
                    Tolerance.AssertClose(theirs.VoltageAt(t, FrontEndNodes.Hold), ours.VoltageAt(t, FrontEndNodes.Hold), 0, (ExampleDesigns.DiodeLawSlackLsb(design) ?? SampleLsb) * lsb,
                        $"conversion {k}, {file} at {celsius} °C, {PrechargeCases.Describe(pre)}");
                }
            }
    }

    private const int Conversions = 16;

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Ac_response_agrees_within_a_hundredth_of_a_decibel_and_a_tenth_of_a_degree(string file)
    {
        var design = ExampleDesigns.Load(file);
        var (celsius, pin) = (Middle(design), FrontEndCircuit.PinNode(design));
        var plot = Ngspice.Value.Run(FrontEndDecks.Write(design, DeckAnalysis.Ac, new DeckOptions { TemperatureCelsius = celsius })).Plot("ac");
        var frequencies = plot["frequency"].Real;
        var theirs = plot[pin].Complex!;
        var ours = AcAnalysis.Run(FrontEndDecks.AcCircuit(design, celsius), FrequencySweep.At(frequencies)).Voltage(pin);
        var oursDb = AcResult.Decibels(ours);
        var theirsDb = AcResult.Decibels(theirs);
        for (var k = 0; k < frequencies.Length; k++)
        {
            var at = $"{file} at {frequencies[k]:G4} Hz";
            Tolerance.AssertClose(theirsDb[k], oursDb[k], 0, 0.01, $"gain (dB), {at}");
            var phase = (ours[k] / theirs[k]).Phase * 180 / Math.PI;
            Tolerance.AssertClose(0, phase, 0, 0.1, $"phase difference (°), {at}");
        }
    }

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Noise_density_agrees_within_one_percent(string file)
    {
        var design = ExampleDesigns.Load(file);
        var (celsius, pin) = (Middle(design), FrontEndCircuit.PinNode(design));
        var plot = Ngspice.Value.Run(FrontEndDecks.Write(design, DeckAnalysis.Noise, new DeckOptions { TemperatureCelsius = celsius })).Plot("noise");
        var frequencies = plot["frequency"].Real;
        var theirs = plot["onoise_spectrum"].Real;
        var ours = NoiseAnalysis.Run(FrontEndDecks.AcCircuit(design, celsius), pin, FrequencySweep.At(frequencies)).OutputDensity;
        for (var k = 0; k < frequencies.Length; k++)
            Tolerance.AssertClose(theirs[k], ours[k], 0.01, 0, $"output noise density, {file} at {frequencies[k]:G4} Hz");
    }

    private static double Middle(ThermVerify.Design.FrontEndDesign design) =>
        (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
}
