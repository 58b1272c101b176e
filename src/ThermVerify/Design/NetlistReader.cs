using ThermVerify.Design.Netlists;
using ThermVerify.Design.Subcircuits;
using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [netlist]: the netlist file (read strictly here, at load), and the names the check needs from it.</summary>
internal static class NetlistReader
{
    private static readonly string[] Keys = ["file", "sensor", "pin", "negative_pin", "reference", "excitation", "fixed", "switch_on_lead", "reading_interval", "part"];
    private static readonly string[] PartKeys = ["name", "tolerance", "tempco"];

    /// <summary>
    /// Names the check adds beside the netlist's own (the converter's sampling network, the precharge source, the pin's
    /// leakage and capacitance; FrontEnd/FrontEndNodes): a netlist may not use them, so that nothing it holds can be
    /// confused with the converter's input.
    /// </summary>
    internal static readonly string[] ReservedNodes = ["hold", "pre", "holdn", "pren", "holdd"];
    internal static readonly string[] ReservedElements = ["Vprecharge", "Rsampling", "Csample", "Ssample", "Sprecharge", "Cpin", "Ileak", "Rinput", "Vac", "Epga", "Ipga", "Iinject",
        "Csamplen", "Ssamplen", "Sprechargen", "Vprechargen", "Cpinn", "Ileakn"];

    public static NetlistSpec Read(TomlSection s)
    {
        s.AllowOnly(Keys);
        var file = s.RequiredString("file", "Name the netlist: file = \"front-end.cir\" (a file in the design's folder).");
        var (fullPath, text) = s.ReadFile("file", file);
        var parsed = NetlistParser.Parse(text, file, s.KeyPath("file"), (included, at, errors, _) => Include(s, included, at, errors));
        CheckReserved(parsed, s.KeyPath("file"));
        var sensors = s.Strings("sensor") ?? throw s.Missing("sensor", "Name the sensor's resistor in the netlist: sensor = \"Rntc\".");
        if (sensors.Count != 1)
            throw s.ErrorAtValue("sensor", sensors.Count == 0 ? "no sensor element" : "more than one sensor element is not supported yet",
                "Name the one resistor whose resistance follows the sensor model: sensor = \"Rntc\".");
        foreach (var name in sensors)
        {
            var element = Element(s, "sensor", name, parsed);
            if (element.Kind != 'R')
                throw s.ErrorAtValue("sensor", $"{name} is not a resistor ({element.At}: '{NetlistErrors.Quote(element.At.Card)}')",
                    "The sensor is the resistor whose value the sensor model sets; name an R element.");
        }
        var pin = NodeOf(s, "pin", parsed, required: true)!;
        var negativePin = NodeOf(s, "negative_pin", parsed, required: false);
        if (negativePin == pin)
            throw s.ErrorAtValue("negative_pin", "the negative input is the same node as pin", "Name the node the converter's negative input reads, another than pin.");
        var reference = NodeOf(s, "reference", parsed, required: false);
        var excitation = s.Strings("excitation") ?? [];
        foreach (var name in excitation)
            if (Element(s, "excitation", name, parsed).Kind is not ('V' or 'I'))
                throw s.ErrorAtValue("excitation", $"{name} is not a source", "Name the V or I elements that excite the sensor.");
        var (lead, interval) = Switching(s, parsed, excitation);
        var fixedElement = s.String("fixed") is { } written ? FixedOf(s, written, parsed, sensors) : null;
        var parts = s.Sections("part").Select(p => Part(p, parsed, sensors)).ToList();
        foreach (var group in parts.GroupBy(p => p.Name, StringComparer.OrdinalIgnoreCase).Where(g => g.Count() > 1))
            throw s.ErrorAtKey("part", $"{group.Key} has more than one [[netlist.part]] entry", "Give each part one entry.");
        return new NetlistSpec
        {
            File = file,
            FullPath = fullPath,
            SensorElements = [.. sensors.Select(n => parsed.Find(n)!.Name)],
            PinNode = pin,
            NegativePinNode = negativePin,
            ReferenceNode = reference,
            ReferenceVolts = reference is null ? null : ReferenceVolts(s, reference, parsed),
            Excitation = [.. excitation.Select(n => parsed.Find(n)!.Name)],
            Parts = parts,
            FixedElement = fixedElement,
            SwitchOnLeadSeconds = lead,
            ReadingIntervalSeconds = interval,
            Parsed = parsed,
        };
    }

    /// <summary>
    /// The switched excitation: `switch_on_lead` (and `reading_interval`), and the sources written with a PULSE, which
    /// must be excitation sources of a design that gives the lead (the pulse says how the source switches, the lead when
    /// the converter samples after it).
    /// </summary>
    private static (double? Lead, double? Interval) Switching(TomlSection s, ParsedNetlist parsed, IReadOnlyList<string> excitation)
    {
        var lead = s.Quantity("switch_on_lead", Bound.Positive, UnitKind.Second)?.Value;
        var interval = s.Quantity("reading_interval", Bound.Positive, UnitKind.Second)?.Value;
        if (lead is not null && excitation.Count == 0)
            throw s.ErrorAtKey("switch_on_lead", "switch_on_lead without an excitation source",
                "Name the sources the firmware switches on to measure: excitation = [\"Vgpio\"].");
        if (interval is not null && lead is null)
            throw s.ErrorAtKey("reading_interval", "reading_interval without switch_on_lead",
                "reading_interval describes a switched excitation: add switch_on_lead = \"10 ms\", or remove reading_interval.");
        if (lead is { } l && interval is { } i && i <= l)
            throw s.ErrorAtValue("reading_interval", "the reading interval is not longer than the switch-on lead",
                "The excitation is on for switch_on_lead plus one conversion in every reading_interval; make the interval longer.");
        foreach (var pulsed in parsed.Elements.Where(e => e.Pulse is not null))
        {
            var at = pulsed.At;
            if (!excitation.Contains(pulsed.Name, StringComparer.OrdinalIgnoreCase))
                throw new DesignException(at.FileName, at.Line, at.Column, s.KeyPath("excitation"),
                    $"{pulsed.Name} is written with a PULSE but is not an excitation source (in the card '{NetlistErrors.Quote(at.Card)}')",
                    $"Only the excitation may be switched: add \"{pulsed.Name}\" to excitation in [netlist], or give the source its DC value.");
            if (lead is null)
                throw new DesignException(at.FileName, at.Line, at.Column, s.KeyPath("switch_on_lead"),
                    $"the PULSE of {pulsed.Name} switches the excitation, but [netlist] does not say when the converter samples after it (in the card '{NetlistErrors.Quote(at.Card)}')",
                    "Add switch_on_lead = \"10 ms\" to [netlist]: how long after the pulse's delay TD the first acquisition window opens.");
            var p = pulsed.Pulse!;
            if (p.RiseSeconds > lead)
                throw new DesignException(at.FileName, at.Line, at.Column, s.KeyPath("switch_on_lead"),
                    $"the PULSE of {pulsed.Name} is still rising when the acquisition window opens (TR {p.RiseSeconds:G4} s, switch_on_lead {lead:G4} s)",
                    "Make switch_on_lead at least the pulse's rise time TR: the check compares the sample with the source at its pulsed level.");
        }
        return (lead, interval);
    }

    private static NetlistPartSpec Part(TomlSection p, ParsedNetlist parsed, IReadOnlyList<string> sensors)
    {
        p.AllowOnly(PartKeys);
        var name = p.RequiredString("name", "Name the netlist element: name = \"R1\".");
        var element = Element(p, "name", name, parsed);
        if (sensors.Contains(element.Name, StringComparer.OrdinalIgnoreCase))
            throw p.ErrorAtValue("name", $"{name} is the sensor", "The sensor's tolerance is in [sensor] (resistance_tolerance); remove this entry.");
        if (element.Kind is not ('R' or 'C' or 'L' or 'V' or 'I'))
            throw p.ErrorAtValue("name", $"{name} is not a resistor, capacitor, inductor or source", "Tolerances are read for R, C, L, V and I elements.");
        if (p.Has("tempco") && element.Kind != 'R')
            throw p.ErrorAtKey("tempco", $"{name} is not a resistor", "A tempco is read for resistors; remove it here.");
        return new NetlistPartSpec(element.Name, SensorReader.Tolerance(p, "tolerance"), p.ValueOr("tempco", 0, Bound.Any, UnitKind.PpmPerKelvin))
        {
            TempcoSigned = SignWritten.Of(p, "tempco"),
        };
    }

    /// <summary>The resistor `choose-fixed` replaces: an R element of the netlist other than the sensor.</summary>
    private static string FixedOf(TomlSection s, string name, ParsedNetlist parsed, IReadOnlyList<string> sensors)
    {
        var element = Element(s, "fixed", name, parsed);
        if (element.Kind != 'R')
            throw s.ErrorAtValue("fixed", $"{name} is not a resistor ({element.At}: '{NetlistErrors.Quote(element.At.Card)}')",
                "Name the resistor choose-fixed is to replace with E-series values: fixed = \"Rtop\".");
        if (sensors.Contains(element.Name, StringComparer.OrdinalIgnoreCase))
            throw s.ErrorAtValue("fixed", $"{name} is the sensor", "Name the resistor beside the sensor that choose-fixed is to replace.");
        return element.Name;
    }

    private static NetlistElement Element(TomlSection s, string key, string name, ParsedNetlist parsed) =>
        parsed.Find(name) ?? throw s.ErrorAtValue(key, $"the netlist has no element {name}",
            KeySuggestion.Nearest(name, parsed.Elements.Select(e => e.Name)) is { } near ? $"Did you mean {near}?" : "Name an element of the netlist as it is written there.");

    private static string? NodeOf(TomlSection s, string key, ParsedNetlist parsed, bool required)
    {
        var written = required
            ? s.RequiredString(key, "Name the node the converter reads: pin = \"adc_in\".")
            : s.String(key);
        if (written is null) return null;
        var node = written.ToLowerInvariant();
        if (node is "0" or "gnd")
            throw s.ErrorAtValue(key, "ground is not a usable node here", "Name the node by its netlist name.");
        if (!parsed.Nodes.Contains(node))
            throw s.ErrorAtValue(key, $"the netlist has no node {written}",
                KeySuggestion.Nearest(node, parsed.Nodes) is { } near ? $"Did you mean {near}?" : "Name a node of the netlist as it is written there.");
        return node;
    }

    /// <summary>The DC value of the voltage source that drives the reference node from ground.</summary>
    private static double ReferenceVolts(TomlSection s, string node, ParsedNetlist parsed) =>
        ReferenceSourceVolts(parsed, node) ?? throw s.ErrorAtValue("reference", $"no DC voltage source drives node {node} from ground",
            "Name the node a DC source drives from ground (e.g. the excitation's top); other reference nodes are not supported yet.");

    /// <summary>The voltage the first DC source that drives <paramref name="node"/> from ground holds it at; null when none does.</summary>
    internal static double? ReferenceSourceVolts(ParsedNetlist parsed, string node)
    {
        foreach (var e in parsed.Elements.Where(e => e.Kind == 'V'))
        {
            var volts = MeasuringVolts(e);
            if (e.Nodes[0] == node && e.Nodes[1] == "0") return volts;
            if (e.Nodes[1] == node && e.Nodes[0] == "0") return -volts;
        }
        return null;
    }

    /// <summary>A source's value while the check measures: a PULSE's pulsed level (the switched excitation is on), else its DC value.</summary>
    internal static double MeasuringVolts(NetlistElement e) => e.Pulse?.Pulsed ?? e.Value;

    private static void CheckReserved(ParsedNetlist parsed, string keyPath)
    {
        foreach (var e in parsed.Elements)
        {
            if (ReservedElements.Contains(e.Name, StringComparer.OrdinalIgnoreCase))
                throw new DesignException(e.At.FileName, e.At.Line, e.At.Column, keyPath, $"the element name {e.Name} is one thermverify gives the converter's input",
                    "Rename the element in the netlist.");
            if (e.Nodes.FirstOrDefault(n => ReservedNodes.Contains(n)) is { } node)
                throw new DesignException(e.At.FileName, e.At.Line, e.At.Column, keyPath, $"the node name {node} is one thermverify gives the converter's input (in the card '{NetlistErrors.Quote(e.At.Card)}')",
                    "Rename the node in the netlist.");
        }
    }

    /// <summary>A file the netlist includes: resolved like every path of a design, inside the design's folder.</summary>
    private static (string FileName, string Text) Include(TomlSection s, string included, SpiceToken at, NetlistErrors errors) =>
        SpiceIncludes.Read(s, included, at, errors.At);
}
