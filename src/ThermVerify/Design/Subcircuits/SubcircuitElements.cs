namespace ThermVerify.Design.Subcircuits;

/// <summary>The element cards of <see cref="SubcircuitParser"/> and the values they take.</summary>
internal sealed partial class SubcircuitParser
{
    /// <summary>A value as it will be written: a plain number, or an expression whose global names are renamed.</summary>
    private delegate string ValueWriter(Func<string, string> rename);

    private void Element(SpiceCard card)
    {
        var first = card.First;
        var scope = open ?? throw errors.At(first, $"element {first.Text} outside a .subckt",
            "A subcircuit file defines subcircuits; put the element between .subckt and .ends.");
        var name = Name(first, "an element name");
        if (!scope.Elements.Add(name))
            throw errors.At(first, $"element {name} appears twice in .subckt {scope.Name}", "Give each element its own name.");
        // Parentheses and commas are separators in SPICE element lines ("POLY(2) (3,0) (4,0)").
        var t = card.Tokens.Where(x => x.Kind is not (SpiceTokenKind.Open or SpiceTokenKind.Close or SpiceTokenKind.Comma)).ToList();
        var letter = char.ToUpperInvariant(name[0]);
        CardWriter writer = letter switch
        {
            'R' or 'C' or 'L' => TwoTerminal(t, scope),
            'V' or 'I' => Source(t, scope),
            'D' => Diode(t, scope),
            'E' or 'G' => Controlled(t, scope, nodesPerControl: 2),
            'F' or 'H' => Controlled(t, scope, nodesPerControl: 1),
            'X' => Instance(t, scope),
            _ => throw errors.At(first, $"element {name}: {Describe(letter)} is not accepted in a subcircuit file",
                "Accepted elements: R, C, L, V, I (DC/AC), D, E, F, G, H (linear or POLY) and X."),
        };
        scope.Cards.Add(writer);
    }

    private static string Describe(char letter) => letter switch
    {
        'B' => "a behavioural source (B)",
        'Q' => "a bipolar transistor (Q)",
        'M' => "a MOSFET (M)",
        'J' => "a JFET (J)",
        'S' or 'W' => "a switch",
        'T' or 'O' or 'U' or 'Y' => "a transmission line",
        'A' => "a code-model instance (A)",
        'K' => "a coupling (K)",
        _ => $"an element of type {letter}",
    };

    private CardWriter TwoTerminal(List<SpiceToken> t, Scope scope)
    {
        var what = $"element {t[0].Text}";
        Require(t, 4, what, $"Write {t[0].Text} NODE1 NODE2 VALUE.");
        var (a, b) = (Node(t[1]), Node(t[2]));
        var value = Value(t[3], scope, what);
        var extra = Assignments(t, 4, scope, "an element parameter");
        return rename => Join(t[0].Text, a, b, value(Local(scope, rename)), extra, Local(scope, rename));
    }

    private CardWriter Source(List<SpiceToken> t, Scope scope)
    {
        var what = $"source {t[0].Text}";
        Require(t, 3, what, $"Write {t[0].Text} NODE+ NODE- [DC] VALUE [AC MAGNITUDE [PHASE]].");
        var (a, b) = (Node(t[1]), Node(t[2]));
        if (t.FirstOrDefault(x => x.Kind == SpiceTokenKind.Word && TransientFunctions.Contains(x.Text)) is { Text.Length: > 0 } waveform)
            throw errors.At(waveform, $"{what}: \"{waveform.Text}\" is not accepted (only DC and AC values)",
                "Transient waveforms (PULSE, SIN, PWL, ...) are not accepted in a subcircuit file.");
        ValueWriter? dc = null;
        var ac = new List<ValueWriter>();
        var i = 3;
        if (i < t.Count && t[i].IsWord("dc")) i++;
        if (i < t.Count && !t[i].IsWord("ac")) dc = Value(t[i++], scope, what);
        if (i < t.Count && t[i].IsWord("ac"))
        {
            i++;
            while (i < t.Count && ac.Count < 2) ac.Add(Value(t[i++], scope, what));
            if (ac.Count == 0)
                throw errors.At(t[i - 1], $"{what}: AC without a magnitude", "Write AC 1, or remove AC.");
        }
        if (i < t.Count)
            throw errors.At(t[i], $"{what}: \"{t[i].Text}\" is not accepted (only DC and AC values)",
                "Transient waveforms (PULSE, SIN, PWL, ...) are not accepted in a subcircuit file.");
        return rename =>
        {
            var r = Local(scope, rename);
            var text = $"{t[0].Text} {a} {b} dc {(dc is null ? "0" : dc(r))}";
            return ac.Count == 0 ? text : $"{text} ac {string.Join(' ', ac.Select(v => v(r)))}";
        };
    }

    private static readonly HashSet<string> TransientFunctions = new(StringComparer.OrdinalIgnoreCase)
    {
        "pulse", "sin", "exp", "pwl", "sffm", "am", "trnoise", "trrandom",
    };

    private CardWriter Diode(List<SpiceToken> t, Scope scope)
    {
        var what = $"diode {t[0].Text}";
        Require(t, 4, what, $"Write {t[0].Text} ANODE CATHODE MODEL [AREA].");
        var (a, k) = (Node(t[1]), Node(t[2]));
        var model = Name(t[3], "a model name");
        ValueWriter? area = t.Count > 4 ? Value(t[4], scope, what) : null;
        if (t.Count > 5)
            throw errors.At(t[5], $"{what}: unexpected \"{t[5].Text}\"", $"Write {t[0].Text} ANODE CATHODE MODEL [AREA].");
        laterChecks.Add(() =>
        {
            if (!scope.Models.ContainsKey(model) && !globalModels.ContainsKey(model))
                throw errors.At(t[3], $"{what}: no diode model {model} is defined", $"Add .model {model} D (...) to the file.");
        });
        return rename =>
        {
            var m = scope.Models.ContainsKey(model) ? model : rename(model);
            return $"{t[0].Text} {a} {k} {m}" + (area is null ? "" : " " + area(Local(scope, rename)));
        };
    }

    /// <summary>E and G (controlled by node pairs), F and H (controlled by voltage sources' currents); linear or POLY(n).</summary>
    private CardWriter Controlled(List<SpiceToken> t, Scope scope, int nodesPerControl)
    {
        var what = $"controlled source {t[0].Text}";
        var form = nodesPerControl == 2 ? "NODE+ NODE- CONTROL+ CONTROL- GAIN" : "NODE+ NODE- VSOURCE GAIN";
        Require(t, 3, what, $"Write {t[0].Text} {form}.");
        var equals = t.FindIndex(x => x.Kind == SpiceTokenKind.Equals);
        if (equals > 0)
            throw errors.At(t[equals - 1], $"{what}: a behavioural form (value=, table, laplace) is not accepted",
                "Write a linear gain, or POLY(n) with its coefficients.");
        var (a, b) = (Node(t[1]), Node(t[2]));
        var i = 3;
        var polynomial = 0;
        if (t[i].IsWord("poly"))
        {
            if (i + 1 >= t.Count || !int.TryParse(t[i + 1].Text, out polynomial) || polynomial is < 1 or > 20)
                throw errors.At(t[i], $"{what}: POLY needs its dimension, 1 to 20", "Write POLY(2) and then the controls.");
            i += 2;
        }
        var controls = new List<string>();
        for (var c = 0; c < Math.Max(1, polynomial) * nodesPerControl; c++)
        {
            if (i >= t.Count)
                throw errors.At(t[^1], $"{what}: a control is missing", $"Write {t[0].Text} {form}.");
            controls.Add(nodesPerControl == 2 ? Node(t[i++]) : Name(t[i++], "a voltage source's name"));
        }
        var coefficients = new List<ValueWriter>();
        while (i < t.Count)
        {
            if (t[i].Kind == SpiceTokenKind.Equals || (i + 1 < t.Count && t[i + 1].Kind == SpiceTokenKind.Equals))
                throw errors.At(t[i], $"{what}: a behavioural form (value=, table, laplace) is not accepted",
                    "Write a linear gain, or POLY(n) with its coefficients.");
            coefficients.Add(Value(t[i++], scope, what));
        }
        if (coefficients.Count == 0 || (polynomial == 0 && coefficients.Count != 1))
            throw errors.At(t[^1], $"{what}: {(coefficients.Count == 0 ? "the gain is missing" : "one gain is expected")}", $"Write {t[0].Text} {form}.");
        return rename =>
        {
            var r = Local(scope, rename);
            var poly = polynomial > 0 ? $" poly({polynomial})" : "";
            return $"{t[0].Text} {a} {b}{poly} {string.Join(' ', controls)} {string.Join(' ', coefficients.Select(v => v(r)))}";
        };
    }

    private CardWriter Instance(List<SpiceToken> t, Scope scope)
    {
        var what = $"instance {t[0].Text}";
        var i = 1;
        var positional = new List<SpiceToken>();
        while (i < t.Count && t[i].Kind == SpiceTokenKind.Word && !t[i].IsWord("params:")
               && !(i + 1 < t.Count && t[i + 1].Kind == SpiceTokenKind.Equals))
            positional.Add(t[i++]);
        if (positional.Count < 2)
            throw errors.At(t[^1], $"{what} needs its nodes and a subcircuit name", $"Write {t[0].Text} NODES... SUBCIRCUIT.");
        var nodes = positional.SkipLast(1).Select(Node).ToList();
        var subcircuit = Name(positional[^1], "a subcircuit name");
        if (i < t.Count && t[i].IsWord("params:")) i++;
        var parameters = Assignments(t, i, scope, "an instance parameter");
        scope.Instances.Add((subcircuit, positional[^1], nodes.Count));
        return rename =>
        {
            var r = Local(scope, rename);
            var text = $"{t[0].Text} {string.Join(' ', nodes)} {rename(subcircuit)}";
            return parameters.Count == 0 ? text : $"{text} params: {string.Join(' ', parameters.Select(p => $"{p.Name}={p.Value(r)}"))}";
        };
    }

    private void CheckInstance(string subcircuit, SpiceToken at, int nodes)
    {
        var target = subcircuits.FirstOrDefault(s => s.Name.Equals(subcircuit, StringComparison.OrdinalIgnoreCase))
            ?? throw errors.At(at, $"subcircuit {subcircuit} is not defined in the file", $"Define .subckt {subcircuit} in the file or a file it includes.");
        if (target.Pins.Count != nodes)
            throw errors.At(at, $"subcircuit {subcircuit} has {target.Pins.Count} pins, the instance gives {nodes} nodes", "Give one node per pin.");
    }

    /// <summary>A subcircuit that instantiates itself, directly or through others, would never stop expanding.</summary>
    private static void CheckNoCycles(IReadOnlyList<SubcircuitDefinition> subcircuits, SubcircuitErrors errors)
    {
        var byName = subcircuits.ToDictionary(s => s.Name, StringComparer.OrdinalIgnoreCase);
        var done = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        foreach (var s in subcircuits)
            Visit(s, []);

        void Visit(SubcircuitDefinition s, List<string> path)
        {
            if (done.Contains(s.Name)) return;
            if (path.Contains(s.Name, StringComparer.OrdinalIgnoreCase))
                throw errors.At(s.Line, 1, $"subcircuit {s.Name} instantiates itself ({string.Join(" → ", path.Append(s.Name))})",
                    "A subcircuit may use others, never itself.");
            path.Add(s.Name);
            foreach (var used in s.Uses)
                if (byName.TryGetValue(used, out var next)) Visit(next, path);
            path.RemoveAt(path.Count - 1);
            done.Add(s.Name);
        }
    }

    /// <summary>NAME = VALUE pairs from <paramref name="start"/> to the end of the card.</summary>
    private List<(string Name, ValueWriter Value)> Assignments(IReadOnlyList<SpiceToken> tokens, int start, Scope? scope, string what)
    {
        var result = new List<(string, ValueWriter)>();
        var i = start;
        while (i < tokens.Count)
        {
            if (tokens[i].Kind is SpiceTokenKind.Open or SpiceTokenKind.Close or SpiceTokenKind.Comma) { i++; continue; }
            var name = Name(tokens[i], what);
            if (i + 1 >= tokens.Count)
                throw errors.At(tokens[i], $"\"{name}\" without \"= value\"", $"Write {name}=VALUE.");
            if (tokens[i + 1].Kind != SpiceTokenKind.Equals)
                throw errors.At(tokens[i + 1], $"\"{tokens[i + 1].Text}\" where \"=\" is expected after {name}", $"Write {name}=VALUE.");
            if (i + 2 >= tokens.Count)
                throw errors.At(tokens[i + 1], $"{name}= without a value", $"Write {name}=VALUE.");
            result.Add((name, Value(tokens[i + 2], scope, $"{what} {name}")));
            i += 3;
        }
        return result;
    }

    /// <summary>A number, or an arithmetic expression ({...}, '...', or a word such as 2*rval) over declared parameters.</summary>
    private ValueWriter Value(SpiceToken token, Scope? scope, string what)
    {
        if (token.Kind == SpiceTokenKind.Word && SpiceNumberText.TryParse(token.Text, out var number))
        {
            var text = SpiceNumberText.Format(number);
            return _ => text;
        }
        if (token.Kind is not (SpiceTokenKind.Word or SpiceTokenKind.Expression))
            throw errors.At(token, $"{what}: \"{token.Text}\" is not a value", "Write a number (1k, 4.7u, 1e-9) or an expression in braces.");
        var offset = token.Kind == SpiceTokenKind.Expression ? 1 : 0;
        var expression = SpiceExpression.Parse(token.Text, (at, problem) =>
            errors.At(token.Line, token.Column + offset + at, $"{what}: {problem}", "Use numbers, parameter names, + - * / and parentheses; put an expression with parentheses or blanks in braces {...}."));
        foreach (var name in expression.Names)
        {
            var n = name;
            laterChecks.Add(() =>
            {
                if (!(scope?.Parameters.Contains(n) ?? false) && !globalParameters.Contains(n))
                    throw errors.At(token, $"{what}: parameter {n} is not defined", $"Define it with .param {n} = VALUE, or as a subcircuit parameter.");
            });
        }
        return expression.Write;
    }

    private void Require(List<SpiceToken> t, int count, string what, string hint)
    {
        if (t.Count < count)
            throw errors.At(t[^1], $"{what} is incomplete", hint);
    }

    private static string Join(string name, string a, string b, string value, List<(string Name, ValueWriter Value)> extra, Func<string, string> rename) =>
        extra.Count == 0 ? $"{name} {a} {b} {value}" : $"{name} {a} {b} {value} {string.Join(' ', extra.Select(e => $"{e.Name}={e.Value(rename)}"))}";
}
