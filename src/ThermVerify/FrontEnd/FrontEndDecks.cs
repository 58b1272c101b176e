using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Sensors;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>The analyses a design's SPICE decks can carry.</summary>
public enum DeckAnalysis { Dc, Tran, Ac, Noise }

/// <summary>Choices for a design's decks; nulls take the check's own values.</summary>
public sealed record DeckOptions
{
    /// <summary>Circuit temperature of the transient, AC and noise decks; null: the middle of the check range.</summary>
    public double? TemperatureCelsius { get; init; }

    /// <summary>Conversions the sampling transient covers.</summary>
    public int Conversions { get; init; } = 16;

    public double StartHertz { get; init; } = 1;

    public double StopHertz { get; init; } = 10e6;

    public int PointsPerDecade { get; init; } = 10;

    /// <summary>
    /// Write the statements that make a batch run print the figures (<c>.print</c>, <c>.meas</c>); false writes the
    /// bare netlist and its analysis.
    /// </summary>
    public bool PrintFigures { get; init; } = true;
}

/// <summary>
/// A design's circuits as SPICE decks: the temperature sweep of the DC circuit over the check range, the sampling
/// transient (the first precharge case the check covers), and AC and noise of the DC circuit with the excitation
/// as the AC input and the ADC pin as the output. The comments name the design and every node.
/// </summary>
internal static class FrontEndDecks
{
    /// <summary>The AC input: the divider's excitation, or the current source.</summary>
    public static string AcInputSource(FrontEndDesign design) => design.Netlist is { } n
        ? n.Excitation.FirstOrDefault() ?? n.Parsed.Elements.First(e => e.Kind is 'V' or 'I').Name
        : design.CurrentSource is null ? "Vexc" : CurrentSourceElement;

    /// <summary>Whether the AC input is a current (its transfer is then in V/A).</summary>
    private static bool CurrentInput(FrontEndDesign design) => design.Netlist is not null
        ? char.ToUpperInvariant(AcInputSource(design)[0]) == 'I'
        : design.CurrentSource is not null;

    public static string Write(FrontEndDesign design, DeckAnalysis analysis, DeckOptions? options = null)
    {
        options ??= new DeckOptions();
        if (design.Adc.Kind == ConverterKind.DeltaSigma && analysis is DeckAnalysis.Dc or DeckAnalysis.Tran)
            return DeltaSigma.DeltaSigmaDecks.Write(design, analysis, options);
        var model = new ClosedFormModel(design);
        var precharge = PrechargeCases.For(design, model.Adc.ReferenceVolts)[0].Volts;
        var celsius = options.TemperatureCelsius ?? (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        var pin = FrontEndCircuit.PinNode(design);
        switch (analysis)
        {
            case DeckAnalysis.Dc:
            {
                var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToList();
                var circuit = FrontEndCircuit.Dc(design, DcLevels.UsesAverageSamplingCurrent(design, precharge) ? precharge : null);
                var drift = BufferStage.DriftFollowsSweep(design)
                    ? "; the op-amp's offset drift is held at 25 °C in this deck (the check drifts it to each swept temperature)" : "";
                return SpiceDeckWriter.Write(circuit, DcTemperatureSweep.From(temperatures),
                    Header(design, circuit, $"temperature sweep over the check range, {PrechargeCases.Describe(precharge)}{drift}",
                        $"prints v({pin}) at each temperature: the check's DC pin voltage (with leakage, bias and average sampling currents)"),
                    Outputs(options, new PrintVectors("dc", design.Netlist is null ? [$"v({Divider})", $"v({pin})"] : [$"v({pin})"])));
            }
            case DeckAnalysis.Tran:
            {
                var settleVolts = design.Check.SettleLimitLsb * model.Adc.LsbVolts;
                // One period more than is measured: ngspice's .meas cannot read at the very end of a run.
                var (circuit, transient) = SamplingRun.Setup(design, celsius, precharge, settleVolts, options.Conversions + 1);
                var differential = SamplingRun.SamplesNegativeInput(design);
                var sweep = new TransientSweep(transient.StopTimeSeconds, transient.MaxStepSeconds)
                {
                    StepGuards = StepGuard.ForSwitches(circuit),
                };
                return SpiceDeckWriter.Write(circuit, sweep, Header(design, circuit,
                    $"sampling transient, {options.Conversions} conversions at {celsius:0.###} °C, {PrechargeCases.Describe(precharge)}; " +
                    (differential ? $"conversion k is v({Hold}) − v({HoldNegative}) at (k+1)/f_s (a differential input)" : $"conversion k is v({Hold}) at (k+1)/f_s"),
                    differential
                        ? $"prints sample_k and sample_neg_k for k = 0 … {options.Conversions - 1}: the two sampling capacitors at conversion k; the converter takes sample_k − sample_neg_k (k = 0 is the check's first conversion)"
                        : $"prints sample_k for k = 0 … {options.Conversions - 1}: the value the converter takes at conversion k (sample_0 is the check's first conversion)"),
                    Outputs(options, [.. Enumerable.Range(0, options.Conversions)
                        .SelectMany(k => differential
                            ? new[] { new MeasureAt($"sample_{k}", Hold, FrontEndCircuit.SampleTimeSeconds(design, k)),
                                      new MeasureAt($"sample_neg_{k}", HoldNegative, FrontEndCircuit.SampleTimeSeconds(design, k)) }
                            : [new MeasureAt($"sample_{k}", Hold, FrontEndCircuit.SampleTimeSeconds(design, k))])]));
            }
            default:
            {
                var circuit = AcCircuit(design, celsius);
                SpiceAnalysis sweep = analysis == DeckAnalysis.Ac
                    ? new AcSweep(options.StartHertz, options.StopHertz, options.PointsPerDecade)
                    : new NoiseSweep(pin, AcInputSource(design), options.StartHertz, options.StopHertz, options.PointsPerDecade);
                return SpiceDeckWriter.Write(circuit, sweep, Header(design, circuit,
                    $"{(analysis == DeckAnalysis.Ac ? "AC response" : "output noise")} of the DC circuit at {celsius:0.###} °C, " +
                    $"input {AcInputSource(design)} (1 {(CurrentInput(design) ? "A" : "V")} AC), output v({pin})",
                    analysis == DeckAnalysis.Ac
                        ? $"prints vdb({pin}) and vp({pin}) (dB and radians) at each frequency: the transfer from the excitation to the pin (V/A for a current source)"
                        : "prints onoise_spectrum at each frequency: the noise density at the pin in V/√Hz"),
                    Outputs(options, analysis == DeckAnalysis.Ac
                        ? new PrintVectors("ac", [$"vdb({pin})", $"vp({pin})"])
                        : new PrintVectors("noise", ["onoise_spectrum"])));
            }
        }
    }

    /// <summary>The DC circuit at <paramref name="celsius"/> with the excitation as a 1 V AC input.</summary>
    public static Circuit AcCircuit(FrontEndDesign design, double celsius)
    {
        var circuit = FrontEndCircuit.Dc(design, null, celsius);
        return circuit[AcInputSource(design)] switch
        {
            VoltageSource v => circuit.Replace(v with { AcMagnitude = 1 }),
            CurrentSource i => circuit.Replace(i with { AcMagnitude = 1 }),
            var other => throw new InvalidOperationException($"{other.Name} is not an independent source."),
        };
    }

    private static IReadOnlyList<SpiceOutput> Outputs(DeckOptions options, params SpiceOutput[] outputs) => options.PrintFigures ? outputs : [];

    /// <summary>
    /// Which tool wrote the deck and from which files, so a deck found later can be traced to its design; the
    /// analysis' own choices (temperature, conversions) are in the line that describes it.
    /// </summary>
    private static string Provenance(FrontEndDesign design) =>
        $"made by thermverify {ToolVersion.Current}; design files: {DesignDigest.Describe(design.Source)}";

    public static SpiceDeckHeader Header(FrontEndDesign design, Circuit circuit, string what, string? prints = null) =>
        new($"thermverify: {design.Name}: {what}")
        {
            Notes = [$"design: {design.Name}" + (design.Description is { } d ? $" ({d})" : ""), Provenance(design), what,
                .. prints is null ? Array.Empty<string>() : [$"ngspice -b on this deck {prints}"]],
            NodeDescriptions = design.Netlist is { } netlist ? new Dictionary<string, string>
            {
                [netlist.PinNode] = $"the converter's input (the netlist {netlist.File}'s node {netlist.PinNode})",
                [Hold] = "sampling capacitor behind the sampling switch",
                [Precharge] = "precharge level of the sampling capacitor",
            } : new Dictionary<string, string>
            {
                [Excitation] = design.CurrentSource is null ? "excitation, the top of the divider" : "current source output, above the reference resistor",
                [Divider] = design.CurrentSource is null ? "divider midpoint, where the sensor meets the fixed resistor" : "the sensor's node, read by the converter",
                [BridgeNegative] = design.Amplifier is null ? "the bridge's opposite midpoint, the converter's negative input" : "the bridge's opposite midpoint, the amplifier's negative input",
                [AmplifierOutput] = "the amplifier's output, drives the filter",
                [AmplifierOffsetInput] = "the amplifier's positive input plus its offset",
                [AmplifierOffsetBase] = "the amplifier's offset stage",
                [AmplifierDifferential] = "the amplifier's differential stage",
                [AmplifierCommonMode] = "the amplifier's common-mode stage",
                [AmplifierDriftStage] = "the amplifier's drift stage: 1 V times (1 + 0.001·(T − 25 °C))",
                [SourceTempco] = "the current source's tempco stage: 1 V times (1 + tempco·(T − 25 °C))",
                [BufferStage.AmplifierOutput] = "op-amp output, before the isolation resistor",
                [BufferStage.Feedback] = "op-amp feedback divider",
                [BufferOutput] = "buffer output, drives the filter",
                [Pin] = "ADC pin, after the series resistor",
                [Hold] = "sampling capacitor behind the sampling switch",
                [HoldNegative] = "the negative input's sampling capacitor behind its own switch",
                [NegativePrecharge] = "the negative sampling capacitor's own precharge level",
                [Precharge] = "precharge level of the sampling capacitor",
            },
        };
}
