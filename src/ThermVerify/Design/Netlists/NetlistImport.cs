using System.Globalization;
using System.Text;

namespace ThermVerify.Design.Netlists;

/// <summary>
/// A starting design file for a netlist (thermverify import): the netlist read strictly, then the sensor, the pin,
/// the excitation and the reference guessed from its names and shape, each guess marked "CONFIRM", and the sensor
/// model, converter and check filled with placeholders marked "FILL IN". Nothing is guessed silently: every line a
/// user must look at says so.
/// </summary>
internal static class NetlistImport
{
    private static readonly string[] SensorWords = ["ntc", "ptc", "rtd", "pt100", "pt1000", "therm", "sens", "temp"];
    private static readonly string[] PinWords = ["adc", "ain", "pin"];

    /// <param name="fileName">The netlist's name as the design will name it (relative to the design's folder).</param>
    /// <param name="include">Reads a file the netlist includes, inside its folder.</param>
    public static string StartingDesign(string text, string fileName,
        Func<string, Subcircuits.SpiceToken, NetlistErrors, int, (string FileName, string Text)> include)
    {
        var netlist = NetlistParser.Parse(text, fileName, "", include);
        var resistors = netlist.Elements.Where(e => e.Kind == 'R').ToList();
        if (resistors.Count == 0)
            throw new DesignException(fileName, 1, 1, "", "the netlist has no resistor, so no sensor", "A thermistor or RTD front end has the sensor as a resistor (R element).");
        var named = resistors.Where(r => SensorWords.Any(w => r.Name.Contains(w, StringComparison.OrdinalIgnoreCase)) || PlatinumName(r.Name)).ToList();
        var sensor = named.FirstOrDefault() ?? resistors[0];
        var sensorWhy = named.Count switch
        {
            1 => "its name reads as a sensor",
            > 1 => $"the first of {string.Join(", ", named.Select(n => n.Name))}, whose names read as sensors",
            _ => "no name reads as a sensor: the first resistor of the netlist",
        };
        var (pin, pinWhy) = Pin(netlist, sensor);
        var sources = netlist.Elements.Where(e => e.Kind is 'V' or 'I').ToList();
        var reference = netlist.Elements.FirstOrDefault(e => e.Kind == 'V' && e.Nodes[1] == "0" && e.Nodes[0] != "0");
        var pulsed = sources.FirstOrDefault(e => e.Pulse is not null);

        var b = new StringBuilder();
        b.AppendLine($"# Starting design written by thermverify import from {fileName} (\"{netlist.Title}\").");
        b.AppendLine("# Every line marked CONFIRM is a guess from the netlist; every line marked FILL IN is a placeholder.");
        b.AppendLine("# Check them all before you trust a result (docs/netlists.md, docs/design-file.md).");
        b.AppendLine($"name = \"{Escape(netlist.Title.Length > 0 ? netlist.Title : Path.GetFileNameWithoutExtension(fileName))}\"");
        b.AppendLine();
        b.AppendLine("[sensor]");
        Commented(b, "model = \"beta\"", "FILL IN: the sensor's model (beta, steinhart-hart, table, rtd)");
        Commented(b, $"r25 = \"{Number(sensor.Value)} ohm\"", $"CONFIRM: the netlist's value of {sensor.Name}");
        Commented(b, "beta = 3435", "FILL IN: from the sensor's documentation");
        b.AppendLine();
        b.AppendLine("[netlist]");
        b.AppendLine($"file = \"{Escape(fileName)}\"");
        Commented(b, $"sensor = \"{sensor.Name}\"", $"CONFIRM: {sensorWhy}");
        Commented(b, $"pin = \"{pin}\"", $"CONFIRM: {pinWhy}");
        if (reference is not null)
            Commented(b, $"reference = \"{reference.Nodes[0]}\"", $"CONFIRM: the node {reference.Name} drives from ground, for a ratiometric converter");
        if (sources.Count > 0)
            Commented(b, $"excitation = [{string.Join(", ", sources.Select(s => $"\"{s.Name}\""))}]", $"CONFIRM: the netlist's sources");
        if (pulsed?.Pulse is { } pulse)
            Commented(b, $"switch_on_lead = \"{Number(pulse.RiseSeconds + Math.Min(pulse.WidthSeconds, 1) / 2)} s\"",
                $"FILL IN: the PULSE of {pulsed.Name} switches the excitation; how long after its TD the first acquisition window opens");
        if (FixedArm(netlist, sensor) is { } arm)
            Commented(b, $"fixed = \"{arm.Resistor.Name}\"", $"CONFIRM: it joins {sensor.Name} to {arm.Source.Name}, the divider's other arm (choose-fixed replaces it)");
        b.AppendLine();
        Commented(b, "[adc]", "FILL IN: every value from the converter's documentation");
        b.AppendLine("bits = 12");
        b.AppendLine(reference is not null ? "reference = \"ratiometric\"" : "reference = \"3.3 V\"");
        b.AppendLine("sample_rate = \"1 kHz\"");
        b.AppendLine("acquisition_time = \"2 us\"");
        b.AppendLine("sampling_capacitance = \"8 pF\"");
        b.AppendLine("switch_resistance = \"1 kohm\"");
        b.AppendLine();
        Commented(b, "[check]", "FILL IN: the range and budget the product needs");
        b.AppendLine("range = \"0 degC .. 70 degC\"");
        b.AppendLine("budget = \"1 K\"");
        return b.ToString();
    }

    /// <summary>A platinum RTD's usual names: "Rpt", "RPT1", "Rpt100" (the letters pt after the R, then digits or nothing).</summary>
    private static bool PlatinumName(string name) =>
        System.Text.RegularExpressions.Regex.IsMatch(name, "^r_?pt[0-9]*$", System.Text.RegularExpressions.RegexOptions.IgnoreCase);

    /// <summary>A node whose name reads as the converter's input; else where a capacitor to ground sits last; else the sensor's node.</summary>
    private static (string Node, string Why) Pin(ParsedNetlist netlist, NetlistElement sensor)
    {
        var nodes = netlist.Nodes.Where(n => n != "0" && !n.Contains('.')).ToList();
        if (nodes.FirstOrDefault(n => PinWords.Any(w => n.Contains(w, StringComparison.OrdinalIgnoreCase))) is { } named)
            return (named, "its name reads as the converter's input");
        if (netlist.Elements.LastOrDefault(e => e.Kind == 'C' && e.Nodes.Contains("0") && e.Nodes.Any(n => n != "0" && !n.Contains('.'))) is { } cap)
            return (cap.Nodes.First(n => n != "0"), $"the node of {cap.Name}, the last capacitor to ground");
        return (sensor.Nodes.First(n => n != "0"), $"the node of {sensor.Name}");
    }

    /// <summary>
    /// The divider's other arm: a resistor other than the sensor between a node of the sensor's and a node a voltage
    /// source drives from ground; null where the netlist has none.
    /// </summary>
    private static (NetlistElement Resistor, NetlistElement Source)? FixedArm(ParsedNetlist netlist, NetlistElement sensor)
    {
        var driven = netlist.Elements.Where(e => e.Kind == 'V' && e.Nodes[1] == "0" && e.Nodes[0] != "0").ToList();
        foreach (var r in netlist.Elements.Where(e => e.Kind == 'R' && e != sensor))
            for (var side = 0; side < 2; side++)
                if (r.Nodes[side] != "0" && sensor.Nodes.Contains(r.Nodes[side]) && driven.FirstOrDefault(v => v.Nodes[0] == r.Nodes[1 - side]) is { } source)
                    return (r, source);
        return null;
    }

    /// <summary>A line with its comment in a column of its own, so that the marks read down the file.</summary>
    private static void Commented(StringBuilder b, string line, string comment) =>
        b.Append(line.PadRight(CommentColumn)).Append(" # ").AppendLine(comment);

    private const int CommentColumn = 40;

    private static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static string Escape(string text) => text.Replace("\\", "\\\\").Replace("\"", "\\\"");
}
