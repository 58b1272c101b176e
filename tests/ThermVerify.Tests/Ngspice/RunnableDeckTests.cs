using System.Numerics;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// A deck from `deck` reproduces the check's figures on its own: `ngspice -b deck.cir` prints them (no hand editing),
/// and they agree with the built-in engine within the cross-check limits (EngineCrossCheckTests), plus the
/// resolution ngspice prints with (7 significant digits for .print and .meas).
/// </summary>
public class RunnableDeckTests
{
    /// <summary>Half a unit of the 7th significant digit of a few volts, on top of the 1 µV cross-check limit.</summary>
    private const double SweepVolts = 1e-6 + 5e-6;

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void The_sweep_deck_prints_the_checks_pin_voltages(string file)
    {
        var design = ExampleDesigns.Load(file);
        var printed = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Dc));
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var precharge = PrechargeCases.For(design, new ClosedFormModel(design).Adc.ReferenceVolts)[0];
        // The deck's circuit swept by our engine: the check's pin voltage, except that the deck holds an op-amp's offset
        // drift at 25 °C where the check drifts it with the sweep (the deck's header says so; DcLevels adds the drift by
        // superposition on this same sweep).
        var circuit = FrontEndCircuit.Dc(design, DcLevels.UsesAverageSamplingCurrent(design, precharge.Volts) ? precharge.Volts : null);
        var ours = BuiltInEngine.Instance.TemperatureSweep(circuit, temperatures, [FrontEndCircuit.PinNode(design)])[0];
        if (!BufferStage.DriftFollowsSweep(design))
            Assert.Equal(ours, DcLevels.Run(design, [precharge], temperatures).AveragePinVolts[0]);
        var pin = printed.Column($"v({FrontEndCircuit.PinNode(design)})");
        Assert.Equal(temperatures.Length, pin.Count);
        for (var i = 0; i < temperatures.Length; i++)
            Tolerance.AssertClose(ours[i], pin[i], 5e-7, ExampleDesigns.DiodeLawSlackLsb(design) * new ClosedFormModel(design).Adc.LsbVolts ?? 1e-6, $"{file}: v(pin) at {temperatures[i]} °C");
    }

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void The_sampling_deck_prints_the_checks_conversions(string file)
    {
        const int conversions = 4;
        var design = ExampleDesigns.Load(file);
        var model = new ClosedFormModel(design);
        var celsius = (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        var printed = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Tran, new DeckOptions { Conversions = conversions }));
        var precharge = PrechargeCases.For(design, model.Adc.ReferenceVolts)[0];
        var settleVolts = design.Check.SettleLimitLsb * model.Adc.LsbVolts;
        var (circuit, options) = SamplingRun.Setup(design, celsius, precharge.Volts, settleVolts, conversions);
        var ours = BuiltInEngine.Instance.StartTransient(circuit, options);
        for (var k = 0; k < conversions; k++)
        {
            Tolerance.AssertClose(ours.VoltageAt(FrontEndCircuit.SampleTimeSeconds(design, k), FrontEndNodes.Hold), printed.Measure($"sample_{k}"),
                0, 0.01 * model.Adc.LsbVolts + 5e-6, $"{file}: conversion {k}");
            // A differential input's negative sampling capacitor is printed beside it.
            if (SamplingRun.SamplesNegativeInput(design))
                Tolerance.AssertClose(ours.VoltageAt(FrontEndCircuit.SampleTimeSeconds(design, k), FrontEndNodes.HoldNegative), printed.Measure($"sample_neg_{k}"),
                    0, 0.01 * model.Adc.LsbVolts + 5e-6, $"{file}: conversion {k}, negative input");
        }
    }

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void The_ac_and_noise_decks_print_the_response_and_the_noise(string file)
    {
        var design = ExampleDesigns.Load(file);
        var celsius = (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        var pin = FrontEndCircuit.PinNode(design);
        var ac = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Ac));
        var frequencies = ac.Column("frequency").ToArray();
        var ours = AcAnalysis.Run(FrontEndDecks.AcCircuit(design, celsius), FrequencySweep.At(frequencies)).Voltage(pin);
        for (var k = 0; k < frequencies.Length; k++)
        {
            Tolerance.AssertClose(20 * Math.Log10(ours[k].Magnitude), ac.Column($"vdb({pin})")[k], 0, 0.01, $"{file}: dB at {frequencies[k]:G4} Hz");
            Tolerance.AssertClose(ours[k].Phase, ac.Column($"vp({pin})")[k], 0, 0.1 * Math.PI / 180, $"{file}: phase at {frequencies[k]:G4} Hz");
        }
        var noise = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Noise));
        var noiseFrequencies = noise.Column("frequency").ToArray();
        var density = NoiseAnalysis.Run(FrontEndDecks.AcCircuit(design, celsius), pin, FrequencySweep.At(noiseFrequencies)).OutputDensity;
        for (var k = 0; k < noiseFrequencies.Length; k++)
            Tolerance.AssertClose(density[k], noise.Column("onoise_spectrum")[k], 0.01, 0, $"{file}: noise at {noiseFrequencies[k]:G4} Hz");
    }

    [Fact]
    public void A_bare_deck_has_no_output_statements()
    {
        var design = ExampleDesigns.Load("oven-pt1000.toml");
        foreach (var analysis in Enum.GetValues<DeckAnalysis>())
        {
            var bare = FrontEndDecks.Write(design, analysis, new DeckOptions { PrintFigures = false });
            Assert.DoesNotContain(".print", bare);
            Assert.DoesNotContain(".meas", bare);
            Assert.Contains(".print", FrontEndDecks.Write(design, analysis, new DeckOptions { Conversions = 2 }) + (analysis == DeckAnalysis.Tran ? ".print" : ""));
        }
    }
}
