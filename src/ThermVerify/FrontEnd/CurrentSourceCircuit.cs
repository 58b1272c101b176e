using ThermVerify.Circuits;
using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The excitation of a current-excited design: the source pushes its current into its output (the excitation node, or
/// the sensor's node itself without a reference resistor), with its output resistance to ground; the reference
/// resistor (and the converter's reference input across it) carries the current from there to the sensor's node, where
/// the sensor returns it to ground. The converter reads the sensor's node; its reference is the reference resistor's
/// voltage, v(exc) − v(div), so the converter's reference inputs sit across that resistor (a differential reference).
/// </summary>
internal static class CurrentSourceCircuit
{
    /// <summary>The node the source drives: where its compliance is judged.</summary>
    public static string OutputNode(CurrentSourceSpec source) => source.ReferenceResistorOhms is null ? Divider : Excitation;

    /// <param name="celsius">The temperature of a circuit built for one; null for the temperature sweep.</param>
    public static void Add(List<Element> elements, CurrentSourceSpec source, double? boardCelsius, double? celsius)
    {
        var output = OutputNode(source);
        // The source sits at the board temperature: known when the design fixes one or the circuit is built for one;
        // in a sweep its tempco follows the sweep through a 1 A, 1 Ω-with-tempco stage driving a transconductance
        // (a linear tempco in both engines, since a plain source has none).
        if ((boardCelsius ?? celsius) is { } at || source.CurrentTempcoPerKelvin == 0)
            elements.Add(new CurrentSource(CurrentSourceElement, Circuit.Ground, output,
                new DcWaveform(CurrentFormula.Amperes(source, boardCelsius ?? celsius ?? 25))));
        else
        {
            elements.Add(new CurrentSource("Itempco", Circuit.Ground, SourceTempco, new DcWaveform(1)));
            elements.Add(new Resistor("Rtempco", SourceTempco, Circuit.Ground, 1, source.CurrentTempcoPerKelvin));
            elements.Add(new Vccs(CurrentSourceElement, Circuit.Ground, output, SourceTempco, Circuit.Ground, source.CurrentAmperes));
        }
        if (source.OutputResistanceOhms is { } rOut)
            elements.Add(new Resistor("Rout", output, Circuit.Ground, rOut));
        if (source.ReferenceResistorOhms is { } reference)
        {
            elements.Add(FrontEndCircuit.FixedResistor(ReferenceResistorElement, Excitation, Divider, reference, source.ReferenceResistorTempcoPerKelvin, boardCelsius));
            if (source.ReferenceInputOhms is { } input)
                elements.Add(new Resistor("Rrefin", Excitation, Divider, input));
        }
    }
}
