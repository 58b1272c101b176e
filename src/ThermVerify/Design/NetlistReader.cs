using ThermVerify.Design.Netlists;
using ThermVerify.Design.Subcircuits;
using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [netlist]: the netlist file (read strictly here, at load), and the names the check needs from it.</summary>
internal static class NetlistReader
{
    private static readonly string[] Keys = ["file", "sensor", "pin", "reference", "excitation", "fixed", "part"];
    private static readonly string[] PartKeys = ["name", "tolerance", "tempco"];

    /// <summary>
    /// Names the check adds beside the netlist's own (the converter's sampling network, the precharge source, the pin's
    /// leakage and capacitance; FrontEnd/FrontEndNodes): a netlist may not use them, so that nothing it holds can be
    /// confused with the converter's input.
    /// </summary>
    internal static readonly string[] ReservedNodes = ["hold", "pre"];
    internal static readonly string[] ReservedElements = ["Vprecharge", "Rsampling", "Csample", "Ssample", "Sprecharge", "Cpin", "Ileak", "Rinput", "Vac", "Epga", "Ipga", "Iinject"];

    public static NetlistSpec Read(TomlSection s)
    {
        s.AllowOnly(Keys);
        var file = s.RequiredString("file", "Name the netlist: file = \"front-end.cir\" (a file in the design's folder).");
        var (fullPath, text) = s.ReadFile("file", file);
        var parsed = NetlistParser.Parse(text, file, s.KeyPath("file"), (included, at, errors, _) => Include(s, included, at, errors));
        CheckReserved(parsed, s.KeyPath("file"));
        if (parsed.Elements.FirstOrDefault(e => e.Pulse is not null) is { } pulsed)
            throw new DesignException(pulsed.At.FileName, pulsed.At.Line, pulsed.At.Column, s.KeyPath("file"),
                $"the PULSE of {pulsed.Name} is read, but a switched source is not checked yet (in the card '{NetlistErrors.Quote(pulsed.At.Card)}')",
                "Give the source its DC value while it measures; the check does not yet follow a netlist's switched excitation.");

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
        var reference = NodeOf(s, "reference", parsed, required: false);
        var excitation = s.Strings("excitation") ?? [];
        foreach (var name in excitation)
            if (Element(s, "excitation", name, parsed).Kind is not ('V' or 'I'))
                throw s.ErrorAtValue("excitation", $"{name} is not a source", "Name the V or I elements that excite the sensor.");
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
            ReferenceNode = reference,
            ReferenceVolts = reference is null ? null : ReferenceVolts(s, reference, parsed),
            Excitation = [.. excitation.Select(n => parsed.Find(n)!.Name)],
            Parts = parts,
            FixedElement = fixedElement,
            Parsed = parsed,
        };
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
        foreach (var e in parsed.Elements.Where(e => e.Kind == 'V' && e.Pulse is null))
        {
            if (e.Nodes[0] == node && e.Nodes[1] == "0") return e.Value;
            if (e.Nodes[1] == node && e.Nodes[0] == "0") return -e.Value;
        }
        return null;
    }

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
