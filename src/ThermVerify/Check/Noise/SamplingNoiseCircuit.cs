using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check.Noise;

/// <summary>
/// The front end during an acquisition, as the noise analysis sees it: the DC circuit at one temperature with the
/// sampling switch closed (its on-resistance) into the sampling capacitor, whose voltage is what the converter keeps
/// when the switch opens. Each resistance's noise is at its own temperature: the sensor at the swept one, the leads at
/// theirs, the board's resistors and the switch at the board temperature (the swept one without it).
/// </summary>
internal static class SamplingNoiseCircuit
{
    /// <summary>The closed sampling switch, as a resistor; its noise is what leaves kT/C on the sampling capacitor.</summary>
    public const string SwitchResistor = "Rswitch";

    public const string SamplingCapacitor = "Csample";

    /// <summary>A differential input's closed negative switch, and the node that carries v(hold) − v(holdn).</summary>
    public const string NegativeSwitchResistor = "Rswitchn";
    public const string DifferentialHold = "holdd";

    /// <summary>The node whose voltage the converter keeps: the sampling capacitor's, or the two capacitors' difference.</summary>
    public static string Output(FrontEndDesign design) => design.Adc.NegativeInput is null ? FrontEndNodes.Hold : DifferentialHold;

    private const double MinimumSwitchOhms = 1e-3;

    public static Circuit Acquiring(FrontEndDesign design, double celsius)
    {
        var elements = FrontEndCircuit.Dc(design, null, celsius).Elements.ToList();
        AddSampling(elements, design);
        return new Circuit(elements, celsius);
    }

    /// <summary>The sampling switch and capacitor on the pin (none when the converter has no sampling capacitance).</summary>
    public static void AddSampling(List<Element> elements, FrontEndDesign design)
    {
        var adc = design.Adc;
        if (!(adc.SamplingCapacitanceFarads > 0)) return;
        elements.Add(new Resistor(SwitchResistor, FrontEndCircuit.PinNode(design), FrontEndNodes.Hold, Math.Max(adc.SwitchResistanceOhms, MinimumSwitchOhms)));
        elements.Add(new Capacitor(SamplingCapacitor, FrontEndNodes.Hold, Circuit.Ground, adc.SamplingCapacitanceFarads));
        if (adc.NegativeInput is not { } negative) return;
        // The negative input acquires at the same time through its own switch; a unity VCVS forms the difference the
        // converter keeps (the 1 Ω it drives gives the node its second connection; an ideal source's output takes its
        // noise current without a voltage).
        elements.Add(new Resistor(NegativeSwitchResistor, FrontEndCircuit.NegativeNode(design), FrontEndNodes.HoldNegative, Math.Max(negative.SwitchResistanceOhms, MinimumSwitchOhms)));
        elements.Add(new Capacitor("Csamplen", FrontEndNodes.HoldNegative, Circuit.Ground, negative.SamplingCapacitanceFarads));
        elements.Add(new Vcvs("Esampled", DifferentialHold, Circuit.Ground, FrontEndNodes.Hold, FrontEndNodes.HoldNegative, 1));
        elements.Add(new Resistor("Rsampled", DifferentialHold, Circuit.Ground, 1));
    }

    /// <summary>The resistances whose noise is not at the circuit's (swept) temperature, by element name.</summary>
    public static IReadOnlyDictionary<string, double> OwnTemperatures(FrontEndDesign design, Circuit circuit)
    {
        var board = design.Check.BoardCelsius;
        var leads = design.Wiring?.LeadCelsius ?? board;
        var own = new Dictionary<string, double>();
        foreach (var e in circuit.Elements.Where(e => e is Resistor or TimedSwitch))
        {
            var t = e.Name.StartsWith("Rlead", StringComparison.Ordinal) ? leads : board;
            if (t is { } celsius) own[e.Name] = celsius;
        }
        return own;
    }
}
