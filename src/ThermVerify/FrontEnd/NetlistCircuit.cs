using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Design;
using ThermVerify.Design.Netlists;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The elements of a netlist front end ([netlist]) as circuit elements: the sensor's resistor follows the sensor
/// model, the parts with a tempco follow the sweep (or sit at the board temperature when the design gives one), and
/// diodes follow SPICE's temperature law about 25 °C (the decks' TNOM). Each element is built from its parsed
/// values and written to a deck from them, never from the file's text.
/// </summary>
internal static class NetlistCircuit
{
    /// <summary>The netlist's elements for the check's circuits (the converter's input is added by <see cref="FrontEndCircuit"/>).</summary>
    public static void Add(List<Element> elements, FrontEndDesign design, double? boardCelsius)
    {
        var netlist = design.Netlist!;
        var sensor = design.Sensor.Build();
        foreach (var e in netlist.Parsed.Elements)
        {
            if (e.Kind == 'R' && netlist.SensorElements.Contains(e.Name, StringComparer.OrdinalIgnoreCase))
            {
                elements.Add(new SensorResistor(e.Name, e.Nodes[0], e.Nodes[1], sensor));
                continue;
            }
            elements.Add(Element(e, netlist, boardCelsius));
        }
    }

    /// <summary>
    /// The netlist with every parasitic and loading removed, for the closed form: nominal values at 25 °C, diodes open
    /// (clamps that do not conduct), the sensor a plain resistor of <paramref name="sensorOhms"/>; nothing of the
    /// converter at its pin.
    /// </summary>
    public static Circuit Ideal(NetlistSpec netlist, double sensorOhms)
    {
        var elements = new List<Element>();
        foreach (var e in netlist.Parsed.Elements)
        {
            if (e.Kind == 'D') continue;
            if (e.Kind == 'R' && netlist.SensorElements.Contains(e.Name, StringComparer.OrdinalIgnoreCase))
                elements.Add(new Resistor(e.Name, e.Nodes[0], e.Nodes[1], sensorOhms));
            else if (e.Kind == 'R')
                elements.Add(new Resistor(e.Name, e.Nodes[0], e.Nodes[1], e.Value));
            else
                elements.Add(Element(e, netlist, SpiceDeckWriter.NominalCelsius));
        }
        return new Circuit(elements, SpiceDeckWriter.NominalCelsius);
    }

    private static Element Element(NetlistElement e, NetlistSpec netlist, double? boardCelsius)
    {
        var n = e.Nodes;
        switch (e.Kind)
        {
            case 'R':
            {
                var part = netlist.Part(e.Name);
                var (tc1, tc2) = part is { TempcoPerKelvin: var t } && (t != 0 || part.TempcoSigned)
                    ? (t, 0.0)
                    : (e.Parameter("tc1", 0), e.Parameter("tc2", 0));
                var resistor = new Resistor(e.Name, n[0], n[1], e.Value, tc1, tc2);
                return boardCelsius is { } board && resistor.DependsOnTemperature
                    ? resistor with { ResistanceOhms = resistor.ResistanceOhmsAt(board), Tc1PerKelvin = 0, Tc2PerKelvinSquared = 0 }
                    : resistor;
            }
            case 'C': return new Capacitor(e.Name, n[0], n[1], e.Value);
            case 'L': return new Inductor(e.Name, n[0], n[1], e.Value);
            case 'V': return new VoltageSource(e.Name, n[0], n[1], Waveform(e));
            case 'I': return new CurrentSource(e.Name, n[0], n[1], Waveform(e));
            case 'E': return new Vcvs(e.Name, n[0], n[1], n[2], n[3], e.Value);
            case 'G': return new Vccs(e.Name, n[0], n[1], n[2], n[3], e.Value);
            case 'F': return new Cccs(e.Name, n[0], n[1], e.Control!, e.Value);
            case 'H': return new Ccvs(e.Name, n[0], n[1], e.Control!, e.Value);
            case 'D':
            {
                var diode = new Diode(e.Name, n[0], n[1], e.Parameter("is", 1e-14), e.Parameter("n", 1), e.Parameter("rs", 0))
                {
                    SaturationReferenceCelsius = SpiceDeckWriter.NominalCelsius,
                    BandGapElectronVolts = e.Parameter("eg", 1.11),
                    SaturationExponent = e.Parameter("xti", 3),
                };
                return boardCelsius is { } board
                    ? diode with { SaturationCurrentAmperes = diode.SaturationCurrentAmperesAt(board), SaturationReferenceCelsius = null }
                    : diode;
            }
            default:
                throw new InvalidOperationException($"netlist element {e.Name} of kind {e.Kind} has no circuit element");
        }
    }

    /// <summary>
    /// A source while the check measures: at its DC value, or at a PULSE's pulsed level (a switched excitation that is
    /// on; its switch-on is followed by <see cref="SwitchedOn"/>).
    /// </summary>
    private static Waveform Waveform(NetlistElement e) => new DcWaveform(NetlistReader.MeasuringVolts(e));

    /// <summary>When a DC excitation source steps on (from 0): short against any time constant of the front end, as the built-in shape's GPIO.</summary>
    public const double DcSwitchOnSeconds = 1e-9;

    /// <summary>A pulse width that outlasts any run, as a number a deck can carry (a PULSE written without PW stays on).</summary>
    private const double Forever = 1e30;

    private static double Finite(double seconds) => double.IsFinite(seconds) ? seconds : Forever;

    /// <summary>
    /// The circuit with the netlist's excitation switched on over time (<c>switch_on_lead</c>): a source written with a
    /// PULSE follows its pulse as parsed (its first level before the delay TD, then the rise to its pulsed level); a DC
    /// excitation source steps from 0 to its value <see cref="DcSwitchOnSeconds"/> after t = 0, so the operating point
    /// is the one with it off. Returns the switch-on instant, the latest of the sources' (the lead counts from there).
    /// </summary>
    public static (Circuit Circuit, double SwitchOnSeconds) SwitchedOn(Circuit circuit, NetlistSpec netlist)
    {
        var switchOn = 0.0;
        foreach (var name in netlist.Excitation)
        {
            var e = netlist.Parsed.Find(name)!;
            var (wave, at) = e.Pulse is { } p
                ? (new PulseWaveform(p.Initial, p.Pulsed, p.DelaySeconds, p.RiseSeconds, p.FallSeconds, Finite(p.WidthSeconds), p.PeriodSeconds), p.DelaySeconds)
                : (new PulseWaveform(0, e.Value, DcSwitchOnSeconds, 0, 0, Forever, 0), DcSwitchOnSeconds);
            // The netlist is the design's own (a built unit's carries its scaled levels), as is the circuit.
            circuit = circuit[e.Name] switch
            {
                VoltageSource v => circuit.Replace(v with { Waveform = wave }),
                CurrentSource i => circuit.Replace(i with { Waveform = wave }),
                var other => throw new InvalidOperationException($"excitation {other.Name} is not a source"),
            };
            switchOn = Math.Max(switchOn, at);
        }
        return (circuit, switchOn);
    }
}
