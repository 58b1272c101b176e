using ThermVerify.Circuits;
using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The excitation of a current-excited design: the source pushes its current into its output, with its output
/// resistance to ground; the reference resistor (and the converter's reference input across it) carries the current to
/// the top of the sensor's chain, where the sensor, through its leads, returns it to ground. The converter reads the
/// divider node (its positive input; the near end of the positive sense lead with 4 wires) against ground, or against
/// the near end of the compensating lead (3 wires) or of the negative sense lead (4 wires); its reference is the
/// reference resistor's voltage, so its reference inputs sit across that resistor (a differential reference).
/// </summary>
internal static class CurrentSourceCircuit
{
    /// <summary>Where the reference resistor ends and the sensor's chain begins: the force lead with 4 wires, else the divider node.</summary>
    public static string ChainTop(FrontEndDesign design) => design.Wiring?.Wires == 4 ? Force : Divider;

    /// <summary>The node the source drives: where its compliance is judged.</summary>
    public static string OutputNode(FrontEndDesign design) => design.CurrentSource!.ReferenceResistorOhms is null ? ChainTop(design) : Excitation;

    /// <summary>The converter's negative input with 3 or 4 wires; null: ground.</summary>
    public static string? NegativeInput(FrontEndDesign design) => design.Wiring?.Wires switch
    {
        3 => Compensation,
        4 => SenseNegative,
        _ => null,
    };

    /// <param name="celsius">The temperature of a circuit built for one; null for the temperature sweep.</param>
    public static void Add(List<Element> elements, FrontEndDesign design, double? boardCelsius, double? celsius)
    {
        var source = design.CurrentSource!;
        var output = OutputNode(design);
        var top = ChainTop(design);
        AddSource(elements, CurrentSourceElement, output, source, 1, boardCelsius, celsius);
        if (source.OutputResistanceOhms is { } rOut)
            elements.Add(new Resistor("Rout", output, Circuit.Ground, rOut));
        if (source.ReferenceResistorOhms is { } reference)
        {
            elements.Add(FrontEndCircuit.FixedResistor(ReferenceResistorElement, Excitation, top, reference, source.ReferenceResistorTempcoPerKelvin, boardCelsius));
            if (source.ReferenceInputOhms is { } input)
                elements.Add(new Resistor("Rrefin", Excitation, top, input));
        }
        if (design.Wiring is not { } wiring)
        {
            elements.Add(new SensorResistor(SensorElement, Divider, Circuit.Ground, design.Sensor.Build()));
            return;
        }
        elements.Add(new SensorResistor(SensorElement, SensorTop, SensorBottom, design.Sensor.Build()));
        Resistor Lead(string name, string a, string b) => FrontEndCircuit.LeadResistor(wiring, name, a, b, boardCelsius);
        elements.Add(Lead("Rlead1", top, SensorTop));
        elements.Add(Lead("Rlead2", SensorBottom, Circuit.Ground));
        if (wiring.Wires == 3)
        {
            // The second, matched current runs through the third lead into the sensor's bottom: its lead's drop
            // cancels the first lead's at the converter's negative input, up to the mismatch.
            AddSource(elements, "Iexc2", Compensation, source, 1 + wiring.CurrentMismatch, boardCelsius, celsius);
            elements.Add(Lead("Rlead3", Compensation, SensorBottom));
        }
        else if (wiring.Wires == 4)
        {
            elements.Add(Lead("Rlead3", SensorTop, Divider));
            elements.Add(Lead("Rlead4", SensorBottom, SenseNegative));
            // The sense leads end at the converter's inputs, which draw no current of their own here (the pin's leakage
            // and sampling are added at the pin): an open switch's 1 TΩ to ground gives each end its second connection
            // (its picoampere-scale current through a lead of ohms is far below a nanovolt).
            elements.Add(new Resistor("Rsensep", Divider, Circuit.Ground, FrontEndCircuit.SwitchOffOhms));
            elements.Add(new Resistor("Rsensen", SenseNegative, Circuit.Ground, FrontEndCircuit.SwitchOffOhms));
        }
    }

    /// <summary>
    /// A source of <paramref name="scale"/> times the design's current at the board temperature: known when the design
    /// fixes one or the circuit is built for one; in a sweep its tempco follows the sweep through a 1 A, 1 Ω-with-tempco
    /// stage driving a transconductance (a linear tempco in both engines, since a plain source has none).
    /// </summary>
    private static void AddSource(List<Element> elements, string name, string node, CurrentSourceSpec source, double scale, double? boardCelsius, double? celsius)
    {
        if ((boardCelsius ?? celsius) is not null || source.CurrentTempcoPerKelvin == 0)
        {
            elements.Add(new CurrentSource(name, Circuit.Ground, node, new DcWaveform(scale * CurrentFormula.Amperes(source, boardCelsius ?? celsius ?? 25))));
            return;
        }
        if (!elements.Any(e => e.Name == "Itempco"))
        {
            elements.Add(new CurrentSource("Itempco", Circuit.Ground, SourceTempco, new DcWaveform(1)));
            elements.Add(new Resistor("Rtempco", SourceTempco, Circuit.Ground, 1, source.CurrentTempcoPerKelvin));
        }
        elements.Add(new Vccs(name, Circuit.Ground, node, SourceTempco, Circuit.Ground, scale * source.CurrentAmperes));
    }
}
