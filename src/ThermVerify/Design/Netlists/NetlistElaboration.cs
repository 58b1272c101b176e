using ThermVerify.Design.Subcircuits;

namespace ThermVerify.Design.Netlists;

/// <summary>Evaluation of what <see cref="NetlistParser"/> read: parameters in order, subcircuits expanded per instance.</summary>
internal sealed partial class NetlistParser
{
    /// <summary>The parameters one scope sees: its own, then the netlist's global ones.</summary>
    private sealed class Scope(Scope? parent)
    {
        private readonly Dictionary<string, double> values = new(StringComparer.OrdinalIgnoreCase);

        public void Set(string name, double value) => values[name] = value;

        public bool TryGet(string name, out double value)
        {
            if (values.TryGetValue(name, out value)) return true;
            return parent is not null && parent.TryGet(name, out value);
        }

        public IEnumerable<string> Names => parent is null ? values.Keys : values.Keys.Concat(parent.Names);
    }

    private sealed class Elaboration(NetlistParser parser)
    {
        private readonly List<NetlistElement> elements = [];
        private readonly Scope globals = new(null);
        private readonly Stack<string> expanding = new();

        /// <summary>F and H with the card they came from: the source they sense may come later in the netlist, as in SPICE.</summary>
        private readonly List<(NetlistElement Element, ElementCardText Card)> sensing = [];

        public List<NetlistElement> Run()
        {
            Statements(parser.topLevel, globals, prefix: "", pins: new Dictionary<string, string>(), localModels: null, depth: 0);
            foreach (var (element, card) in sensing)
                if (!elements.Any(x => x.Kind == 'V' && x.Name.Equals(element.Control, StringComparison.OrdinalIgnoreCase)))
                    throw card.Errors.At(card.Reference!.Value, $"{card.NameToken.Text} senses the current of {card.Reference.Value.Text}, which the netlist{(element.Name.Contains('.') ? " (in this subcircuit)" : "")} does not have",
                        Suggest(card.Reference.Value.Text, elements.Where(x => x.Kind == 'V').Select(x => x.Name), "Name a voltage source of the netlist (a 0 V source in series measures a branch's current)."), card.Card);
            return [.. elements.Select(e => e.Control is { } c ? e with { Control = elements.First(x => x.Kind == 'V' && x.Name.Equals(c, StringComparison.OrdinalIgnoreCase)).Name } : e)];
        }

        private void Statements(List<object> statements, Scope scope, string prefix, Dictionary<string, string> pins,
            Dictionary<string, ModelCard>? localModels, int depth)
        {
            foreach (var statement in statements)
            {
                switch (statement)
                {
                    case ParameterCard p:
                        foreach (var a in p.Assignments)
                            scope.Set(a.Name.Text, Evaluate(a.Value, scope, p.Errors, p.Card));
                        break;
                    case ElementCardText e when e.Kind == 'X':
                        Expand(e, scope, prefix, pins, depth);
                        break;
                    case ElementCardText e:
                        Add(e, scope, prefix, pins, localModels);
                        break;
                }
            }
        }

        private void Add(ElementCardText e, Scope scope, string prefix, Dictionary<string, string> pins, Dictionary<string, ModelCard>? localModels)
        {
            if (elements.Count >= MaximumElements)
                throw e.Errors.At(e.NameToken, $"more than {MaximumElements} elements after the subcircuits are expanded", "A front end needs far fewer; check the instances.", e.Card);
            var nodes = e.Nodes.Select(n => MapNode(n, prefix, pins)).ToList();
            var place = new NetlistPlace(e.Errors.FileName, e.NameToken.Line, e.NameToken.Column, e.Card);
            var name = prefix.Length == 0 ? e.NameToken.Text : prefix + e.NameToken.Text;
            switch (e.Kind)
            {
                case 'R' or 'C' or 'L':
                {
                    var value = Evaluate(e.Value!.Value, scope, e.Errors, e.Card);
                    if (!(value > 0))
                        throw e.Errors.At(e.Value.Value, $"{Describe(e.Kind, e.NameToken.Text)} has the value {value:G6}; it must be greater than zero",
                            "Give a positive value (a short is a 0 V source; an open is no element).", e.Card);
                    Distinct(e, nodes);
                    var named = e.Named.ToDictionary(a => a.Name.Text.ToLowerInvariant(), a => Evaluate(a.Value, scope, e.Errors, e.Card));
                    elements.Add(new NetlistElement(e.Kind, name, nodes, value, place) { Parameters = named });
                    break;
                }
                case 'V' or 'I':
                {
                    Distinct(e, nodes);
                    var pulse = e.Pulse.Select(p => Evaluate(p, scope, e.Errors, e.Card)).ToList();
                    var dc = e.Value is { } v ? Evaluate(v, scope, e.Errors, e.Card) : pulse[0];
                    NetlistPulse? wave = null;
                    if (pulse.Count > 0)
                    {
                        double At(int k) => k < pulse.Count ? pulse[k] : 0;
                        wave = new NetlistPulse(At(0), At(1), At(2), At(3), At(4), pulse.Count > 5 ? pulse[5] : double.PositiveInfinity, At(6));
                        if (wave.DelaySeconds < 0 || wave.RiseSeconds < 0 || wave.FallSeconds < 0 || wave.WidthSeconds < 0 || wave.PeriodSeconds < 0)
                            throw e.Errors.At(e.Pulse[0], "a PULSE with a negative time", "Times (TD TR TF PW PER) are zero or positive.", e.Card);
                        if (e.Value is not null && dc != wave.Initial)
                            throw e.Errors.At(e.Value.Value, $"the DC value {dc:G6} differs from the PULSE's first level {wave.Initial:G6}",
                                "SPICE starts the transient from the DC value; give one value, or make them equal.", e.Card);
                    }
                    elements.Add(new NetlistElement(e.Kind, name, nodes, dc, place) { Pulse = wave });
                    break;
                }
                case 'D':
                {
                    Distinct(e, nodes);
                    ModelCard? local = null;
                    localModels?.TryGetValue(e.Reference!.Value.Text, out local);
                    var model = local
                        ?? (parser.globalModels.TryGetValue(e.Reference!.Value.Text, out var global) ? global : null)
                        ?? throw e.Errors.At(e.Reference!.Value, $"diode {e.NameToken.Text} names the model {e.Reference.Value.Text}, which is not defined",
                            Suggest(e.Reference.Value.Text, (localModels?.Keys.AsEnumerable() ?? []).Concat(parser.globalModels.Keys), "Define it with .model NAME D (IS=... N=...)."), e.Card);
                    var modelScope = local is not null && ReferenceEquals(model, local) ? scope : globals;
                    var parameters = model.Parameters.ToDictionary(a => a.Name.Text.ToLowerInvariant(), a => Evaluate(a.Value, modelScope, model.Errors, model.Card));
                    foreach (var (key, positive) in new[] { ("is", true), ("n", true), ("rs", false), ("eg", true) })
                        if (parameters.TryGetValue(key, out var p) && !(positive ? p > 0 : p >= 0))
                            throw model.Errors.At(model.Parameters.First(a => a.Name.Text.Equals(key, StringComparison.OrdinalIgnoreCase)).Name,
                                $"the diode parameter {key} is {p:G6}", positive ? "It must be greater than zero." : "It must not be negative.", model.Card);
                    elements.Add(new NetlistElement('D', name, nodes, 0, place) { Parameters = parameters });
                    break;
                }
                case 'F' or 'H':
                {
                    var value = Evaluate(e.Value!.Value, scope, e.Errors, e.Card);
                    if (nodes[0] == nodes[1])
                        throw e.Errors.At(e.NodeTokens[1], $"element {e.NameToken.Text} has both outputs on node {nodes[0]}", "Connect its outputs to two different nodes.", e.Card);
                    // Inside an instance the sensed source is the instance's own, named as its elements are.
                    var element = new NetlistElement(e.Kind, name, nodes, value, place) { Control = prefix + e.Reference!.Value.Text };
                    elements.Add(element);
                    sensing.Add((element, e));
                    break;
                }
                default: // E, G
                {
                    var value = Evaluate(e.Value!.Value, scope, e.Errors, e.Card);
                    if (nodes[0] == nodes[1])
                        throw e.Errors.At(e.NodeTokens[1], $"element {e.NameToken.Text} has both outputs on node {nodes[0]}", "Connect its outputs to two different nodes.", e.Card);
                    elements.Add(new NetlistElement(e.Kind, name, nodes, value, place));
                    break;
                }
            }
        }

        private static void Distinct(ElementCardText e, List<string> nodes)
        {
            if (nodes[0] == nodes[1])
                throw e.Errors.At(e.NodeTokens[1], $"element {e.NameToken.Text} has both terminals on node {nodes[0]}",
                    "Connect it between two different nodes, or remove it.", e.Card);
        }

        private void Expand(ElementCardText x, Scope scope, string prefix, Dictionary<string, string> pins, int depth)
        {
            var reference = x.Reference!.Value;
            var definition = parser.subcircuits.TryGetValue(reference.Text, out var d) ? d
                : throw x.Errors.At(reference, $"instance {x.NameToken.Text} names the subcircuit {reference.Text}, which is not defined",
                    Suggest(reference.Text, parser.subcircuits.Keys, "Define it with .subckt ... .ends, or .include the file that does."), x.Card);
            if (depth + 1 > MaximumInstanceDepth)
                throw x.Errors.At(x.NameToken, $"subcircuits nested more than {MaximumInstanceDepth} deep", "Flatten some of the levels.", x.Card);
            if (expanding.Contains(definition.Name))
                throw x.Errors.At(reference, $"subcircuit {definition.Name} uses itself (through {string.Join(" → ", expanding.Reverse())})",
                    "A subcircuit cannot contain itself; break the cycle.", x.Card);
            if (x.Nodes.Count != definition.Pins.Count)
                throw x.Errors.At(reference, $"instance {x.NameToken.Text} gives {x.Nodes.Count} nodes; .subckt {definition.Name} has {definition.Pins.Count} pins ({string.Join(' ', definition.Pins)})",
                    "Connect one node to each pin, in the order of the .subckt card.", x.Card);
            var inner = new Scope(globals);
            foreach (var a in definition.Defaults)
                inner.Set(a.Name.Text, Evaluate(a.Value, globals, definition.Errors, $".subckt {definition.Name}"));
            foreach (var a in x.Named)
            {
                if (!definition.Defaults.Any(p => p.Name.Text.Equals(a.Name.Text, StringComparison.OrdinalIgnoreCase)))
                    throw x.Errors.At(a.Name, $"subcircuit {definition.Name} has no parameter {a.Name.Text}",
                        Suggest(a.Name.Text, definition.Defaults.Select(p => p.Name.Text), "Give only the parameters its .subckt card lists after params:."), x.Card);
                inner.Set(a.Name.Text, Evaluate(a.Value, scope, x.Errors, x.Card));
            }
            var map = new Dictionary<string, string>();
            for (var k = 0; k < x.Nodes.Count; k++)
                map[definition.Pins[k]] = MapNode(x.Nodes[k], prefix, pins);
            expanding.Push(definition.Name);
            Statements(definition.Statements, inner, prefix + x.NameToken.Text + ".", map, definition.Models, depth + 1);
            expanding.Pop();
        }

        /// <summary>
        /// A node inside an instance: a pin is the node it connects to, ground stays ground, and an internal node is
        /// named instance.node, as SPICE names it (a '.' no name in the file can hold, so no collision).
        /// </summary>
        private static string MapNode(string node, string prefix, Dictionary<string, string> pins) =>
            node == "0" ? "0" : pins.TryGetValue(node, out var outer) ? outer : prefix.ToLowerInvariant() + node;

        private double Evaluate(SpiceToken token, Scope scope, NetlistErrors errors, string card)
        {
            if (token.Kind == SpiceTokenKind.Word)
            {
                if (SpiceNumberText.TryParse(token.Text, out var number)) return number;
                throw errors.At(token, $"\"{token.Text}\" is not a value",
                    scope.TryGet(token.Text, out _) ? $"Write the parameter in braces: {{{token.Text}}}." : "Write a number with an optional scale factor (4.7k, 100n, 1meg) or an expression in braces.", card);
            }
            return NetlistArithmetic.Evaluate(token.Text,
                (name, offset) => scope.TryGet(name, out var v) ? v
                    : throw errors.At(token.Line, token.Column + 1 + offset, $"parameter {name} is not defined (in the card '{NetlistErrors.Quote(card)}')",
                        Suggest(name, scope.Names, "Define it with .param before the card that uses it.")),
                (offset, problem, hint) => errors.At(token.Line, token.Column + 1 + offset, $"{problem} (in the card '{NetlistErrors.Quote(card)}')", hint));
        }

        private static string Suggest(string name, IEnumerable<string> known, string otherwise) =>
            KeySuggestion.Nearest(name, known.Distinct(StringComparer.OrdinalIgnoreCase)) is { } near ? $"Did you mean {near}? {otherwise}" : otherwise;
    }
}
