using ThermVerify.Design.Subcircuits;

namespace ThermVerify.Design.Netlists;

/// <summary>The element cards of <see cref="NetlistParser"/>, read for their syntax; values are evaluated later, per instance.</summary>
internal sealed partial class NetlistParser
{
    /// <summary>An element card as read: its nodes, its value and named values as written, a model or subcircuit it names.</summary>
    private sealed record ElementCardText(char Kind, SpiceToken NameToken, IReadOnlyList<string> Nodes, IReadOnlyList<SpiceToken> NodeTokens,
        SpiceToken? Value, IReadOnlyList<Assignment> Named, IReadOnlyList<SpiceToken> Pulse, SpiceToken? Reference, NetlistErrors Errors, string Card);

    private static ElementCardText ElementCard(SpiceCard card, NetlistErrors errors, string quoted)
    {
        var first = card.First;
        var name = Name(first, errors, quoted, "an element name");
        var kind = char.ToUpperInvariant(name[0]);
        var t = Separated(card.Tokens);
        return kind switch
        {
            'R' => Passive(kind, t, errors, quoted, ["tc1", "tc2"]),
            'C' or 'L' => Passive(kind, t, errors, quoted, []),
            'V' or 'I' => Source(kind, t, errors, quoted),
            'D' => Diode(t, errors, quoted),
            'E' or 'G' => Controlled(kind, t, errors, quoted),
            'F' or 'H' => CurrentControlled(kind, t, errors, quoted),
            'X' => Instance(t, errors, quoted),
            _ => throw errors.At(first, $"element {name}: {Describe(kind)} is not {(NotYet(kind) ? "supported yet" : "accepted")}",
                "Supported: R, C, L, V and I (DC, PULSE), D with .model D, E, F, G and H (linear), X with .subckt.", quoted),
        };
    }

    private static bool NotYet(char kind) => kind is 'S' or 'W' or 'Q' or 'M' or 'J' or 'K' or 'T' or 'B';

    private static string Describe(char kind) => kind switch
    {
        'F' => "a current-controlled current source",
        'H' => "a current-controlled voltage source",
        'S' => "a voltage-controlled switch",
        'W' => "a current-controlled switch",
        'Q' => "a bipolar transistor",
        'M' => "a MOSFET",
        'J' => "a JFET",
        'Z' => "a MESFET",
        'K' => "a coupling of inductors",
        'T' or 'O' or 'U' or 'Y' => "a transmission line",
        'B' => "a behavioural source",
        'A' => "an XSPICE code model",
        'N' or 'P' => "a device of a simulator's own",
        _ => $"an element of type '{kind}'",
    };

    private static List<string> Nodes(IReadOnlyList<SpiceToken> t, int count, NetlistErrors errors, string quoted, string shape)
    {
        if (t.Count < 1 + count)
            throw errors.At(t[^1], $"element {t[0].Text} needs {count} nodes", $"Write {shape}.", quoted);
        return [.. t.Skip(1).Take(count).Select(x => Node(x, errors, quoted))];
    }

    private static ElementCardText Passive(char kind, List<SpiceToken> t, NetlistErrors errors, string quoted, string[] named)
    {
        var unit = kind switch { 'R' => "10k", 'C' => "100n", _ => "10u" };
        var shape = $"{t[0].Text} NODE1 NODE2 VALUE, e.g. {t[0].Text} a b {unit}";
        var nodes = Nodes(t, 2, errors, quoted, shape);
        if (t.Count >= 4 && t[3].Kind == SpiceTokenKind.Word && char.IsAsciiLetter(t[3].Text[0]) && !(t.Count > 4 && t[4].Kind == SpiceTokenKind.Equals))
            throw errors.At(t[3], $"\"{t[3].Text}\" is not a value", $"Write a number (e.g. {unit}), or a parameter in braces: {{{t[3].Text}}}.", quoted);
        if (t.Count < 4 || !IsValue(t[3]) || (t.Count > 4 && t[4].Kind == SpiceTokenKind.Equals))
            throw errors.At(t[Math.Min(3, t.Count - 1)], $"element {t[0].Text} has no value", $"Write {shape}.", quoted);
        var assignments = Assignments(t, 4, errors, quoted, "an element parameter", requireOne: false);
        foreach (var a in assignments)
            if (!named.Contains(a.Name.Text.ToLowerInvariant()))
                throw errors.At(a.Name, $"{a.Name.Text} is not read on {Describe(kind, t[0].Text)}",
                    named.Length == 0 ? "Remove it; only the value is read." : $"Accepted: {string.Join(", ", named)}.", quoted);
        return new ElementCardText(kind, t[0], nodes, t.Skip(1).Take(2).ToList(), t[3], assignments, [], null, errors, quoted);
    }

    private static string Describe(char kind, string name) => kind switch { 'R' => $"resistor {name}", 'C' => $"capacitor {name}", _ => $"inductor {name}" };

    private static readonly string[] NotYetWaveforms = ["sin", "pwl", "exp", "sffm", "am", "trnoise", "trrandom", "distof1", "distof2"];

    /// <summary>V and I: a DC value (with or without "dc"), optionally "ac" (left to the check's own analyses) and a PULSE.</summary>
    private static ElementCardText Source(char kind, List<SpiceToken> t, NetlistErrors errors, string quoted)
    {
        var shape = $"{t[0].Text} NODE+ NODE- [DC] VALUE, or PULSE(V1 V2 TD TR TF PW PER)";
        var nodes = Nodes(t, 2, errors, quoted, shape);
        SpiceToken? value = null;
        var pulse = new List<SpiceToken>();
        var i = 3;
        while (i < t.Count)
        {
            var x = t[i];
            if (x.IsWord("dc"))
            {
                if (i + 1 >= t.Count || !IsValue(t[i + 1]))
                    throw errors.At(x, "DC with no value", "Write DC 3.3.", quoted);
                if (value is not null)
                    throw errors.At(x, "a second DC value", "Give the source one DC value.", quoted);
                value = t[i + 1];
                i += 2;
            }
            else if (x.IsWord("ac"))
            {
                // The AC stimulus belongs to an analysis; the check drives its own. Magnitude and phase are read and left.
                i++;
                for (var k = 0; k < 2 && i < t.Count && IsValue(t[i]); k++) i++;
            }
            else if (x.IsWord("pulse"))
            {
                if (pulse.Count > 0)
                    throw errors.At(x, "a second PULSE", "Give the source one PULSE.", quoted);
                i++;
                while (i < t.Count && IsValue(t[i]) && pulse.Count < 7) pulse.Add(t[i++]);
                if (pulse.Count < 2)
                    throw errors.At(x, "PULSE needs at least its two levels", "Write PULSE(V1 V2 TD TR TF PW PER).", quoted);
            }
            else if (x.Kind == SpiceTokenKind.Word && NotYetWaveforms.Contains(x.Text.ToLowerInvariant()))
                throw errors.At(x, $"the waveform {x.Text.ToUpperInvariant()} is not supported yet", "Give a DC value or a PULSE.", quoted);
            else if (IsValue(x) && value is null && pulse.Count == 0)
            {
                value = x;
                i++;
            }
            else
                throw errors.At(x, $"'{x.Text}' is not part of a source", $"Write {shape}.", quoted);
        }
        if (value is null && pulse.Count == 0)
            throw errors.At(t[^1], $"source {t[0].Text} has no value", $"Write {shape}.", quoted);
        return new ElementCardText(kind, t[0], nodes, t.Skip(1).Take(2).ToList(), value, [], pulse, null, errors, quoted);
    }

    private static ElementCardText Diode(List<SpiceToken> t, NetlistErrors errors, string quoted)
    {
        var shape = $"{t[0].Text} ANODE CATHODE MODEL";
        var nodes = Nodes(t, 2, errors, quoted, shape);
        if (t.Count < 4 || t[3].Kind != SpiceTokenKind.Word)
            throw errors.At(t[^1], $"diode {t[0].Text} names no model", $"Write {shape}, with .model MODEL D (IS=...).", quoted);
        if (t.Count > 4)
            throw errors.At(t[4], $"'{t[4].Text}' after the diode's model is not read", "Remove it (area and instance parameters are not modelled).", quoted);
        return new ElementCardText('D', t[0], nodes, t.Skip(1).Take(2).ToList(), null, [], [], t[3], errors, quoted);
    }

    private static ElementCardText Controlled(char kind, List<SpiceToken> t, NetlistErrors errors, string quoted)
    {
        var shape = $"{t[0].Text} NODE+ NODE- CONTROL+ CONTROL- {(kind == 'E' ? "GAIN" : "TRANSCONDUCTANCE")}";
        if (t.Count > 3 && t[3].Kind == SpiceTokenKind.Word && t[3].Text.ToLowerInvariant() is "poly" or "value" or "table" or "vol" or "cur" or "laplace")
            throw errors.At(t[3], $"the {t[3].Text.ToUpperInvariant()} form of {t[0].Text} is not supported yet", $"Write the linear form: {shape}.", quoted);
        var nodes = Nodes(t, 4, errors, quoted, shape);
        if (t.Count != 6 || !IsValue(t[5]))
            throw errors.At(t[Math.Min(5, t.Count - 1)], $"element {t[0].Text} needs one gain after its four nodes", $"Write {shape}.", quoted);
        return new ElementCardText(kind, t[0], nodes, t.Skip(1).Take(4).ToList(), t[5], [], [], null, errors, quoted);
    }

    /// <summary>F and H: two nodes, the voltage source whose current controls them, and the gain (F) or transresistance (H).</summary>
    private static ElementCardText CurrentControlled(char kind, List<SpiceToken> t, NetlistErrors errors, string quoted)
    {
        var shape = $"{t[0].Text} NODE+ NODE- VSOURCE {(kind == 'F' ? "GAIN" : "TRANSRESISTANCE")}";
        if (t.Count > 3 && t[3].Kind == SpiceTokenKind.Word && t[3].Text.ToLowerInvariant() is "poly" or "value" or "table")
            throw errors.At(t[3], $"the {t[3].Text.ToUpperInvariant()} form of {t[0].Text} is not supported yet", $"Write the linear form: {shape}.", quoted);
        var nodes = Nodes(t, 2, errors, quoted, shape);
        if (t.Count < 4 || t[3].Kind != SpiceTokenKind.Word || !char.IsAsciiLetter(t[3].Text[0]))
            throw errors.At(t[Math.Min(3, t.Count - 1)], $"element {t[0].Text} names no voltage source whose current it senses", $"Write {shape}.", quoted);
        var control = t[3];
        Name(control, errors, quoted, "a voltage source's name");
        if (char.ToUpperInvariant(control.Text[0]) != 'V')
            throw errors.At(control, $"{t[0].Text} senses the current of {control.Text}, which is not a voltage source",
                "SPICE's F and H sense the current through a V element; put a 0 V source in series with the branch and name it.", quoted);
        if (t.Count != 5 || !IsValue(t[4]))
            throw errors.At(t[Math.Min(4, t.Count - 1)], $"element {t[0].Text} needs one {(kind == 'F' ? "gain" : "transresistance")} after its source", $"Write {shape}.", quoted);
        return new ElementCardText(kind, t[0], nodes, t.Skip(1).Take(2).ToList(), t[4], [], [], control, errors, quoted);
    }

    private static ElementCardText Instance(List<SpiceToken> t, NetlistErrors errors, string quoted)
    {
        var end = 1;
        while (end < t.Count && t[end].Kind == SpiceTokenKind.Word && !t[end].IsWord("params:")
               && !(end + 1 < t.Count && t[end + 1].Kind == SpiceTokenKind.Equals))
            end++;
        if (end < 3)
            throw errors.At(t[^1], $"instance {t[0].Text} needs its nodes and a subcircuit's name", $"Write {t[0].Text} NODE1 NODE2 ... SUBCKT [NAME=VALUE ...].", quoted);
        var reference = t[end - 1];
        Name(reference, errors, quoted, "a subcircuit's name");
        var nodeTokens = t.Skip(1).Take(end - 2).ToList();
        var nodes = nodeTokens.Select(x => Node(x, errors, quoted)).ToList();
        var from = end < t.Count && t[end].IsWord("params:") ? end + 1 : end;
        var assignments = Assignments(t, from, errors, quoted, "an instance parameter", requireOne: false);
        return new ElementCardText('X', t[0], nodes, nodeTokens, null, assignments, [], reference, errors, quoted);
    }

    /// <summary>A token that can be a value: a number as written, or an expression (a bare name is caught when evaluated).</summary>
    private static bool IsValue(SpiceToken token) => token.Kind == SpiceTokenKind.Expression
        || (token.Kind == SpiceTokenKind.Word && token.Text.Length > 0 && (char.IsAsciiDigit(token.Text[0]) || token.Text[0] is '.' or '+' or '-'));
}
