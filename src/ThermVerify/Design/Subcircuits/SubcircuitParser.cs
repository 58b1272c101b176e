using System.Text.RegularExpressions;

namespace ThermVerify.Design.Subcircuits;

/// <summary>
/// A strict reader of the SPICE a user's op-amp subcircuit file may hold, so that an untrusted file can be checked
/// safely: .subckt/.ends, .model (diodes), .param (plain arithmetic), .include of another file inside the design's
/// folder, and the elements R, C, L, V, I (DC and AC values), D, E, F, G, H (linear or POLY) and X. Everything else
/// is refused with its file, line and column: control sections (.control/.endc, which can run shell commands),
/// analyses, options, functions, behavioural sources, strings, and any element outside a .subckt. What is accepted
/// is re-emitted card by card (<see cref="SubcircuitLibrary"/>), never copied.
/// </summary>
internal sealed partial class SubcircuitParser
{
    public const int MaximumIncludeDepth = 4;
    private const int MaximumNameLength = 64;

    private readonly SubcircuitErrors errors;
    private readonly Func<string, SpiceToken, int, (string FileName, string Text)> include;
    private readonly List<SubcircuitDefinition> subcircuits;
    private readonly List<CardWriter> topLevel;
    private readonly Dictionary<string, string> globalModels; // lower-case name → type
    private readonly HashSet<string> globalParameters;
    private readonly List<Action> laterChecks;
    private readonly int depth;
    private Scope? open;

    /// <param name="include">Reads an included file: (path as written, where, depth) → (name for messages, text); refuses paths outside the folder.</param>
    private SubcircuitParser(SubcircuitErrors errors, Func<string, SpiceToken, int, (string, string)> include, int depth, SubcircuitParser? parent)
    {
        this.errors = errors;
        this.include = include;
        this.depth = depth;
        subcircuits = parent?.subcircuits ?? [];
        topLevel = parent?.topLevel ?? [];
        globalModels = parent?.globalModels ?? new(StringComparer.OrdinalIgnoreCase);
        globalParameters = parent?.globalParameters ?? new(StringComparer.OrdinalIgnoreCase);
        laterChecks = parent?.laterChecks ?? [];
    }

    /// <summary>Reads a subcircuit file and everything it includes; throws <see cref="DesignException"/> at the offending place.</summary>
    public static SubcircuitLibrary Parse(string text, string fileName, string keyPath,
        Func<string, SpiceToken, int, (string FileName, string Text)> include)
    {
        var parser = new SubcircuitParser(new SubcircuitErrors(fileName, keyPath), include, 0, null);
        parser.ReadAll(text);
        foreach (var check in parser.laterChecks) check();
        CheckNoCycles(parser.subcircuits, parser.errors);
        return new SubcircuitLibrary(parser.subcircuits, parser.topLevel);
    }

    /// <summary>What one open .subckt knows while it is read: its pins and parameters, local models, its cards.</summary>
    private sealed class Scope(string name, int line)
    {
        public string Name { get; } = name;
        public int Line { get; } = line;
        public List<string> Pins { get; } = [];
        public HashSet<string> Parameters { get; } = new(StringComparer.OrdinalIgnoreCase);
        public Dictionary<string, string> Models { get; } = new(StringComparer.OrdinalIgnoreCase);
        public HashSet<string> Elements { get; } = new(StringComparer.OrdinalIgnoreCase);
        public List<CardWriter> Cards { get; } = [];
        public List<(string Subcircuit, SpiceToken At, int Nodes)> Instances { get; } = [];
    }

    private void ReadAll(string text)
    {
        var ended = false;
        foreach (var card in SpiceCardReader.Read(text, errors))
        {
            var first = card.First;
            if (ended)
                throw errors.At(first, "a line after .end", "Remove .end, or everything after it.");
            if (first.Kind != SpiceTokenKind.Word)
                throw errors.At(first, $"a line starting with '{first.Text}'", "Start each line with an element name or a dot command.");
            var word = first.Text.ToLowerInvariant();
            if (word.StartsWith('.'))
            {
                switch (word)
                {
                    case ".subckt": OpenSubcircuit(card); break;
                    case ".ends": CloseSubcircuit(card); break;
                    case ".model": Model(card); break;
                    case ".param": Parameters(card); break;
                    case ".include" or ".inc": Include(card); break;
                    case ".end": ended = true; break;
                    default:
                        throw errors.At(first, $"'{first.Text}' is not accepted in a subcircuit file",
                            "A subcircuit file may hold .subckt/.ends, .model, .param and .include (of a file in the design's folder) and elements; " +
                            "control sections (.control/.endc), analyses, options and functions are refused.");
                }
                continue;
            }
            Element(card);
        }
        if (open is not null && depth == 0)
            throw errors.At(open.Line, 1, $".subckt {open.Name} has no .ends", "End the subcircuit with .ends.");
    }

    private void OpenSubcircuit(SpiceCard card)
    {
        if (open is not null)
            throw errors.At(card.First, $".subckt inside .subckt {open.Name}", "End the first subcircuit with .ends before the next; nested definitions are not accepted.");
        var tokens = card.Tokens;
        var name = NameAt(tokens, 1, "the subcircuit's name");
        if (subcircuits.Any(s => s.Name.Equals(name, StringComparison.OrdinalIgnoreCase)))
            throw errors.At(tokens[1], $"subcircuit {name} is defined twice", "Keep one definition.");
        var scope = new Scope(name, tokens[0].Line);
        var i = 2;
        for (; i < tokens.Count && tokens[i].Kind == SpiceTokenKind.Word && !tokens[i].IsWord("params:")
               && !(i + 1 < tokens.Count && tokens[i + 1].Kind == SpiceTokenKind.Equals); i++)
            scope.Pins.Add(Node(tokens[i]));
        if (scope.Pins.Count == 0)
            throw errors.At(tokens[^1], $"subcircuit {name} has no pins", "List its pins after the name.");
        if (i < tokens.Count && tokens[i].IsWord("params:")) i++;
        var defaults = Assignments(tokens, i, scope: null, "a subcircuit parameter");
        foreach (var (parameter, _) in defaults) scope.Parameters.Add(parameter);
        open = scope;
        scope.Cards.Add(rename => $".subckt {rename(name)} {string.Join(' ', scope.Pins)}"
                                  + (defaults.Count == 0 ? "" : " params: " + string.Join(' ', defaults.Select(d => $"{d.Name}={d.Value(rename)}"))));
    }

    private void CloseSubcircuit(SpiceCard card)
    {
        var scope = open ?? throw errors.At(card.First, ".ends with no .subckt open", "Remove it, or add the .subckt it closes.");
        if (card.Tokens.Count > 1 && !card.Tokens[1].Text.Equals(scope.Name, StringComparison.OrdinalIgnoreCase))
            throw errors.At(card.Tokens[1], $".ends {card.Tokens[1].Text} closes .subckt {scope.Name}", $"Write .ends {scope.Name}.");
        if (card.Tokens.Count > 2)
            throw errors.At(card.Tokens[2], "unexpected text after .ends", "Write .ends NAME.");
        scope.Cards.Add(rename => $".ends {rename(scope.Name)}");
        foreach (var (subcircuit, at, nodes) in scope.Instances)
            laterChecks.Add(() => CheckInstance(subcircuit, at, nodes));
        subcircuits.Add(new SubcircuitDefinition(scope.Name, scope.Pins, scope.Cards, scope.Line, [.. scope.Instances.Select(x => x.Subcircuit)]));
        open = null;
    }

    private void Model(SpiceCard card)
    {
        var tokens = card.Tokens.Where(t => t.Kind is not (SpiceTokenKind.Open or SpiceTokenKind.Close or SpiceTokenKind.Comma)).ToList();
        var name = NameAt(tokens, 1, "the model's name");
        if (tokens.Count < 3 || tokens[2].Kind != SpiceTokenKind.Word)
            throw errors.At(tokens[^1], $"model {name} has no type", "Write .model NAME D (IS=1e-14 N=1).");
        var type = tokens[2].Text.ToLowerInvariant();
        if (type != "d")
            throw errors.At(tokens[2], $"model type {tokens[2].Text} is not accepted", "A subcircuit file may define diode models (type D) only.");
        var scope = open;
        var models = scope?.Models ?? globalModels;
        if (models.ContainsKey(name))
            throw errors.At(tokens[1], $"model {name} is defined twice", "Keep one definition.");
        models[name] = type;
        var assignments = Assignments(tokens, 3, scope, "a model parameter");
        CardWriter writer = rename =>
            $".model {(scope is null ? rename(name) : name)} d ({string.Join(' ', assignments.Select(a => $"{a.Name}={a.Value(Local(scope, rename))}"))})";
        (scope?.Cards ?? topLevel).Add(writer);
    }

    private void Parameters(SpiceCard card)
    {
        var scope = open;
        var assignments = Assignments(card.Tokens, 1, scope, "a parameter");
        if (assignments.Count == 0)
            throw errors.At(card.First, ".param with no parameter", "Write .param NAME = VALUE.");
        foreach (var (name, _) in assignments)
            (scope?.Parameters ?? globalParameters).Add(name);
        CardWriter writer = rename => ".param " + string.Join(' ', assignments.Select(a =>
            $"{(scope is null ? rename(a.Name) : a.Name)}={a.Value(Local(scope, rename))}"));
        (scope?.Cards ?? topLevel).Add(writer);
    }

    private void Include(SpiceCard card)
    {
        if (open is not null)
            throw errors.At(card.First, ".include inside a .subckt", "Include files at the top level of the file.");
        if (card.Tokens.Count != 2 || card.Tokens[1].Kind is not (SpiceTokenKind.Word or SpiceTokenKind.Quoted))
            throw errors.At(card.First, ".include needs one file name", "Write .include other.lib (a file in the design's folder).");
        if (depth + 1 > MaximumIncludeDepth)
            throw errors.At(card.Tokens[1], $"includes nested more than {MaximumIncludeDepth} deep", "Include the files from fewer levels.");
        var (fileName, text) = include(card.Tokens[1].Text, card.Tokens[1], depth + 1);
        var child = new SubcircuitParser(new SubcircuitErrors(fileName, ""), include, depth + 1, this);
        child.ReadAll(text);
        if (child.open is not null)
            throw child.errors.At(child.open.Line, 1, $".subckt {child.open.Name} has no .ends", "End the subcircuit with .ends.");
    }

    /// <summary>The expression renamer inside a scope: a scope's own parameters keep their names, the file's global ones are prefixed.</summary>
    private static Func<string, string> Local(Scope? scope, Func<string, string> rename) =>
        name => scope is not null && scope.Parameters.Contains(name) ? name : rename(name);

    private string NameAt(IReadOnlyList<SpiceToken> tokens, int index, string what)
    {
        if (index >= tokens.Count || tokens[index].Kind != SpiceTokenKind.Word)
            throw errors.At(tokens[Math.Min(index, tokens.Count - 1)], $"{what} is missing", "Give a name of letters, digits and '_'.");
        return Name(tokens[index], what);
    }

    private string Name(SpiceToken token, string what)
    {
        if (token.Kind != SpiceTokenKind.Word || !NamePattern().IsMatch(token.Text) || token.Text.Length > MaximumNameLength)
            throw errors.At(token, $"\"{token.Text}\" is not usable as {what}",
                $"Use letters, digits and '_' (at most {MaximumNameLength}), starting with a letter.");
        return token.Text;
    }

    private string Node(SpiceToken token)
    {
        if (token.Kind != SpiceTokenKind.Word || !NodePattern().IsMatch(token.Text) || token.Text.Length > MaximumNameLength)
            throw errors.At(token, $"\"{token.Text}\" is not usable as a node name", "Use letters, digits and '_' for node names.");
        return token.Text;
    }

    [GeneratedRegex("^[A-Za-z][A-Za-z0-9_]*$")]
    private static partial Regex NamePattern();

    [GeneratedRegex("^[A-Za-z0-9_]+$")]
    private static partial Regex NodePattern();
}
