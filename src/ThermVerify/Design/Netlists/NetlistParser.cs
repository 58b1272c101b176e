using System.Text.RegularExpressions;
using ThermVerify.Design.Subcircuits;

namespace ThermVerify.Design.Netlists;

/// <summary>
/// A strict reader of the Berkeley SPICE a front end may be given as: the first line is the title (as SPICE reads
/// it); elements R, C, L, V and I (DC, PULSE), D with .model D, E and G (linear), X with .subckt/.ends; .param with
/// plain arithmetic; .include of a file inside the design's folder; engineering suffixes, '+' continuation lines,
/// '*' and ';' comments as SPICE reads them. Everything else is refused at its file, line and column with the card
/// quoted: control sections (.control/.endc, which can run shell commands), analyses, options, unknown dot-cards,
/// and the elements not supported yet (F, H, switches, transistors, behavioural sources). The result is flat
/// (<see cref="ParsedNetlist"/>): subcircuits expanded, parameters evaluated, node names in lower case; nothing of
/// the file's text survives but names checked against a safe character set and numbers.
/// </summary>
internal sealed partial class NetlistParser
{
    public const int MaximumIncludeDepth = 4;
    public const int MaximumInstanceDepth = 8;
    public const int MaximumElements = 20_000;
    private const int MaximumNameLength = 64;

    private static readonly string[] DotCards = [".subckt", ".ends", ".param", ".model", ".include", ".inc", ".end", ".title"];

    private readonly Func<string, SpiceToken, NetlistErrors, int, (string FileName, string Text)> include;
    private readonly List<object> topLevel = [];
    private readonly Dictionary<string, Definition> subcircuits = new(StringComparer.OrdinalIgnoreCase);
    private readonly Dictionary<string, ModelCard> globalModels = new(StringComparer.OrdinalIgnoreCase);
    private readonly HashSet<string> topNames = new(StringComparer.OrdinalIgnoreCase);
    private Definition? open;
    private bool ended;

    private NetlistParser(Func<string, SpiceToken, NetlistErrors, int, (string, string)> include) => this.include = include;

    /// <summary>Reads a netlist and everything it includes; throws <see cref="DesignException"/> at the offending place.</summary>
    /// <param name="include">Reads an included file: (path as written, where, the including file's errors, depth) → (name for messages, text); refuses paths outside the folder.</param>
    public static ParsedNetlist Parse(string text, string fileName, string keyPath,
        Func<string, SpiceToken, NetlistErrors, int, (string FileName, string Text)> include)
    {
        var errors = new NetlistErrors(fileName, keyPath);
        var parser = new NetlistParser(include);
        var (title, body) = Title(text, errors);
        parser.ReadFile(body, errors, 0);
        if (parser.open is { } unclosed)
            throw unclosed.Errors.At(unclosed.NameToken, $".subckt {unclosed.Name} has no .ends", "End the subcircuit with .ends.");
        var elements = new Elaboration(parser).Run();
        if (elements.Count == 0)
            throw errors.At(1, 1, "the netlist has no elements", "Give the front end's elements (R, C, V, ...) between the title line and .end.");
        return new ParsedNetlist(title, elements);
    }

    /// <summary>
    /// The first line is the title, as SPICE reads it. A first line that reads as a card would be lost to SPICE without
    /// a word, so it is refused rather than guessed at.
    /// </summary>
    private static (string Title, string Body) Title(string text, NetlistErrors errors)
    {
        var end = text.IndexOf('\n');
        var first = (end < 0 ? text : text[..end]).TrimEnd('\r');
        var body = end < 0 ? "" : "\n" + text[(end + 1)..];
        var trimmed = first.Trim();
        if (trimmed.StartsWith(".title", StringComparison.OrdinalIgnoreCase) && (trimmed.Length == 6 || trimmed[6] is ' ' or '\t'))
            return (Printable(trimmed[6..].Trim()), body);
        var words = trimmed.Split([' ', '\t'], StringSplitOptions.RemoveEmptyEntries);
        if (trimmed.StartsWith('.') || (words.Length >= 3 && "RCLVIDEGFHXBQMJSWKTOUrclvidegfhxbqmjswktou".Contains(trimmed[0]) && !trimmed.StartsWith('*')))
            throw errors.At(1, 1, $"the first line '{NetlistErrors.Quote(trimmed)}' reads as a card, but SPICE takes a netlist's first line as its title",
                "Add a title line above it (e.g. '* kiln vent front end'); SPICE would ignore this card.");
        return (Printable(trimmed.TrimStart('*').Trim()), body);
    }

    private static string Printable(string text) => new([.. text.Select(c => c is >= ' ' and <= '~' ? c : '?').Take(120)]);

    private void ReadFile(string text, NetlistErrors errors, int depth)
    {
        foreach (var card in SpiceCardReader.Read(text, new SubcircuitErrors(errors.FileName, errors.KeyPath)))
        {
            var first = card.First;
            var quoted = CardText(card);
            if (ended)
                throw errors.At(first, "a card after .end", "Remove .end, or everything after it.", quoted);
            if (first.Kind != SpiceTokenKind.Word)
                throw errors.At(first, $"a card starting with '{first.Text}'", "Start each card with an element name or a dot card.", quoted);
            var word = first.Text.ToLowerInvariant();
            if (!word.StartsWith('.'))
            {
                var element = ElementCard(card, errors, quoted);
                var names = open?.Names ?? topNames;
                if (!names.Add(element.NameToken.Text))
                    throw errors.At(first, $"element {element.NameToken.Text} appears twice" + (open is null ? "" : $" in .subckt {open.Name}"),
                        "Give each element its own name.", quoted);
                (open?.Statements ?? topLevel).Add(element);
                continue;
            }
            switch (word)
            {
                case ".subckt": OpenSubcircuit(card, errors, quoted); break;
                case ".ends": CloseSubcircuit(card, errors, quoted); break;
                case ".model": Model(card, errors, quoted); break;
                case ".param": (open?.Statements ?? topLevel).Add(new ParameterCard(Assignments(card.Tokens, 1, errors, quoted, "a parameter", requireOne: true), errors, quoted)); break;
                case ".include" or ".inc": Include(card, errors, depth, quoted); break;
                case ".end": ended = depth == 0 ? true : throw errors.At(first, ".end in an included file", "Remove it; .end belongs at the end of the netlist itself.", quoted); break;
                case ".title": throw errors.At(first, ".title after the first line", "Make it the first line of the netlist, or remove it.", quoted);
                default:
                    throw errors.At(first, UnknownDotCard(word), DotCardHint(word), quoted);
            }
        }
    }

    private static string UnknownDotCard(string word) => word switch
    {
        ".control" or ".endc" => $"'{word}' opens or closes a control section, which is never run",
        ".tran" or ".dc" or ".ac" or ".op" or ".noise" or ".tf" or ".sens" or ".pz" or ".disto" or ".four" => $"the analysis '{word}' is not accepted",
        ".lib" => "'.lib' is not accepted",
        _ => $"the dot card '{word}' is not accepted",
    };

    private static string DotCardHint(string word) => word switch
    {
        ".control" or ".endc" => "Remove the control section: thermverify runs its own analyses and never passes commands to a simulator.",
        ".tran" or ".dc" or ".ac" or ".op" or ".noise" or ".tf" or ".sens" or ".pz" or ".disto" or ".four" or ".meas" or ".measure" or ".print" or ".plot" or ".save" or ".probe" or ".temp" or ".options" or ".option" or ".ic" or ".nodeset" =>
            "Remove it: the check sets its own analyses, temperatures and options.",
        ".lib" => "Copy the models or subcircuits the front end uses into a file of the design's folder and .include it.",
        _ => KeySuggestion.Nearest(word, DotCards) is { } near
            ? $"Did you mean {near}? Accepted: {string.Join(", ", DotCards)}."
            : $"Accepted: {string.Join(", ", DotCards)}.",
    };

    private void OpenSubcircuit(SpiceCard card, NetlistErrors errors, string quoted)
    {
        if (open is not null)
            throw errors.At(card.First, $".subckt inside .subckt {open.Name}", "End the first subcircuit with .ends before the next; nested definitions are not accepted.", quoted);
        var tokens = card.Tokens;
        if (tokens.Count < 2)
            throw errors.At(card.First, "the subcircuit's name is missing", "Write .subckt NAME PIN1 PIN2 ...", quoted);
        var name = Name(tokens[1], errors, quoted, "a subcircuit's name");
        if (subcircuits.ContainsKey(name))
            throw errors.At(tokens[1], $"subcircuit {name} is defined twice", "Keep one definition.", quoted);
        var definition = new Definition(name, tokens[1], errors);
        var i = 2;
        for (; i < tokens.Count && tokens[i].Kind == SpiceTokenKind.Word && !tokens[i].IsWord("params:")
               && !(i + 1 < tokens.Count && tokens[i + 1].Kind == SpiceTokenKind.Equals); i++)
        {
            var pin = Node(tokens[i], errors, quoted);
            if (pin == "0")
                throw errors.At(tokens[i], "ground as a subcircuit pin", "Ground is global: remove it from the pins and use 0 inside the subcircuit.", quoted);
            if (definition.Pins.Contains(pin))
                throw errors.At(tokens[i], $"pin {pin} is listed twice", "List each pin once.", quoted);
            definition.Pins.Add(pin);
        }
        if (definition.Pins.Count == 0)
            throw errors.At(tokens[^1], $"subcircuit {name} has no pins", "List its pins after the name.", quoted);
        if (i < tokens.Count && tokens[i].IsWord("params:")) i++;
        definition.Defaults.AddRange(Assignments(tokens, i, errors, quoted, "a subcircuit parameter", requireOne: false));
        open = definition;
    }

    private void CloseSubcircuit(SpiceCard card, NetlistErrors errors, string quoted)
    {
        var definition = open ?? throw errors.At(card.First, ".ends with no .subckt open", "Remove it, or add the .subckt it closes.", quoted);
        if (card.Tokens.Count > 1 && !card.Tokens[1].Text.Equals(definition.Name, StringComparison.OrdinalIgnoreCase))
            throw errors.At(card.Tokens[1], $".ends {card.Tokens[1].Text} closes .subckt {definition.Name}", $"Write .ends {definition.Name}.", quoted);
        if (card.Tokens.Count > 2)
            throw errors.At(card.Tokens[2], "unexpected text after .ends", "Write .ends NAME.", quoted);
        subcircuits[definition.Name] = definition;
        open = null;
    }

    private void Model(SpiceCard card, NetlistErrors errors, string quoted)
    {
        var tokens = Separated(card.Tokens);
        if (tokens.Count < 2)
            throw errors.At(card.First, "the model's name is missing", "Write .model NAME D (IS=1e-14 N=1).", quoted);
        var name = Name(tokens[1], errors, quoted, "a model's name");
        if (tokens.Count < 3 || tokens[2].Kind != SpiceTokenKind.Word)
            throw errors.At(tokens[^1], $"model {name} has no type", "Write .model NAME D (IS=1e-14 N=1).", quoted);
        if (!tokens[2].IsWord("d"))
            throw errors.At(tokens[2], $"model type {tokens[2].Text} is not supported yet", "Only diode models (type D) are read; transistors and switches are not supported yet.", quoted);
        var models = open?.Models ?? globalModels;
        if (models.ContainsKey(name))
            throw errors.At(tokens[1], $"model {name} is defined twice", "Keep one definition.", quoted);
        var parameters = Assignments(tokens, 3, errors, quoted, "a model parameter", requireOne: false);
        foreach (var p in parameters)
            if (!DiodeParameters.Contains(p.Name.Text.ToLowerInvariant()))
                throw errors.At(p.Name, $"diode parameter {p.Name.Text} is not modelled", DiodeParameterHint(p.Name.Text), quoted);
        models[name] = new ModelCard(name, parameters, errors, quoted);
    }

    private static readonly string[] DiodeParameters = ["is", "n", "rs", "eg", "xti"];

    private static string DiodeParameterHint(string name)
    {
        var near = KeySuggestion.Nearest(name, DiodeParameters);
        return (near is null ? "" : $"Did you mean {near}? ") +
               "The diode is modelled by its Shockley equation (is, n, rs, and eg and xti for its temperature law); junction capacitance, " +
               "breakdown and transit time are not: remove the parameter (its effect would be missing from every result).";
    }

    private void Include(SpiceCard card, NetlistErrors errors, int depth, string quoted)
    {
        if (open is not null)
            throw errors.At(card.First, ".include inside a .subckt", "Include files at the top level of the netlist.", quoted);
        if (card.Tokens.Count != 2 || card.Tokens[1].Kind is not (SpiceTokenKind.Word or SpiceTokenKind.Quoted))
            throw errors.At(card.First, ".include needs one file name", "Write .include parts.lib (a file in the design's folder).", quoted);
        if (depth + 1 > MaximumIncludeDepth)
            throw errors.At(card.Tokens[1], $"includes nested more than {MaximumIncludeDepth} deep", "Include the files from fewer levels.", quoted);
        var (fileName, text) = include(card.Tokens[1].Text, card.Tokens[1], errors, depth + 1);
        ReadFile(text, new NetlistErrors(fileName, errors.KeyPath), depth + 1);
        if (open is { } unclosed)
            throw unclosed.Errors.At(unclosed.NameToken, $".subckt {unclosed.Name} has no .ends in the file that opens it", "End the subcircuit with .ends.");
    }

    /// <summary>name=value pairs from <paramref name="from"/> on; values are numbers or expressions.</summary>
    private static List<Assignment> Assignments(IReadOnlyList<SpiceToken> all, int from, NetlistErrors errors, string quoted, string what, bool requireOne)
    {
        var tokens = Separated(all.Skip(from).ToList());
        var list = new List<Assignment>();
        for (var i = 0; i < tokens.Count; i += 3)
        {
            var name = tokens[i];
            if (name.Kind != SpiceTokenKind.Word || i + 1 >= tokens.Count || tokens[i + 1].Kind != SpiceTokenKind.Equals)
                throw errors.At(name, $"'{name.Text}' where {what} (NAME=VALUE) is expected", "Write NAME=VALUE, e.g. rload=10k or gain={2*k}.", quoted);
            Name(name, errors, quoted, $"{what}'s name");
            if (i + 2 >= tokens.Count || tokens[i + 2].Kind is not (SpiceTokenKind.Word or SpiceTokenKind.Expression))
                throw errors.At(tokens[i + 1], $"{name.Text}= has no value", "Write a number or an expression in braces after '='.", quoted);
            if (list.Any(a => a.Name.Text.Equals(name.Text, StringComparison.OrdinalIgnoreCase)))
                throw errors.At(name, $"{name.Text} is given twice", "Give it once.", quoted);
            list.Add(new Assignment(name, tokens[i + 2]));
        }
        if (requireOne && list.Count == 0)
            throw errors.At(all[0], $"{all[0].Text} with nothing to define", "Write .param NAME=VALUE.", quoted);
        return list;
    }

    /// <summary>Parentheses and commas are separators in SPICE cards ("PULSE(0 1 ...)", "(IS=1e-14)").</summary>
    private static List<SpiceToken> Separated(IReadOnlyList<SpiceToken> tokens) =>
        [.. tokens.Where(x => x.Kind is not (SpiceTokenKind.Open or SpiceTokenKind.Close or SpiceTokenKind.Comma))];

    /// <summary>The card as read, for messages: its tokens joined, expressions back in braces.</summary>
    private static string CardText(SpiceCard card) => string.Join(' ', card.Tokens.Select(t => t.Kind switch
    {
        SpiceTokenKind.Expression => "{" + t.Text + "}",
        SpiceTokenKind.Quoted => "\"" + t.Text + "\"",
        _ => t.Text,
    })).Replace(" = ", "=").Replace(" ( ", "(").Replace(" )", ")");

    private static string Name(SpiceToken token, NetlistErrors errors, string quoted, string what)
    {
        if (token.Kind != SpiceTokenKind.Word || !NamePattern().IsMatch(token.Text) || token.Text.Length > MaximumNameLength)
            throw errors.At(token, $"\"{token.Text}\" is not usable as {what}",
                $"Use letters, digits and '_' (at most {MaximumNameLength}), starting with a letter.", quoted);
        return token.Text;
    }

    /// <summary>A node's name in lower case (SPICE's names are not case-sensitive); "0" and "gnd" are ground.</summary>
    private static string Node(SpiceToken token, NetlistErrors errors, string quoted)
    {
        if (token.Kind != SpiceTokenKind.Word || !NodePattern().IsMatch(token.Text) || token.Text.Length > MaximumNameLength)
            throw errors.At(token, $"\"{token.Text}\" is not usable as a node name",
                $"Use letters, digits and '_' for node names (at most {MaximumNameLength}); rename the net in the schematic.", quoted);
        var node = token.Text.ToLowerInvariant();
        return node is "gnd" ? "0" : node;
    }

    [GeneratedRegex("^[A-Za-z][A-Za-z0-9_]*$")]
    private static partial Regex NamePattern();

    [GeneratedRegex("^[A-Za-z0-9_]+$")]
    private static partial Regex NodePattern();

    private sealed record Assignment(SpiceToken Name, SpiceToken Value);

    private sealed record ParameterCard(IReadOnlyList<Assignment> Assignments, NetlistErrors Errors, string Card);

    private sealed record ModelCard(string Name, IReadOnlyList<Assignment> Parameters, NetlistErrors Errors, string Card);

    /// <summary>A .subckt as read: its pins, default parameters, cards in order (elements and .param) and local models.</summary>
    private sealed class Definition(string name, SpiceToken nameToken, NetlistErrors errors)
    {
        public string Name { get; } = name;
        public SpiceToken NameToken { get; } = nameToken;
        public NetlistErrors Errors { get; } = errors;
        public List<string> Pins { get; } = [];
        public List<Assignment> Defaults { get; } = [];
        public List<object> Statements { get; } = [];
        public Dictionary<string, ModelCard> Models { get; } = new(StringComparer.OrdinalIgnoreCase);
        public HashSet<string> Names { get; } = new(StringComparer.OrdinalIgnoreCase);
    }
}
