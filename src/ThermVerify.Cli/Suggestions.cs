using System.CommandLine;
using ThermVerify.Design;

namespace ThermVerify.Cli;

/// <summary>"Did you mean" for a mistyped command or option: the nearest name the parser knows (Levenshtein distance).</summary>
internal static class Suggestions
{
    public static IEnumerable<string> For(ParseResult parsed)
    {
        var command = parsed.CommandResult.Command;
        foreach (var token in parsed.UnmatchedTokens.Distinct())
        {
            if (token.StartsWith('-'))
            {
                var options = command.Options.SelectMany(o => o.Aliases.Prepend(o.Name)).Where(n => n.StartsWith("--", StringComparison.Ordinal));
                if (KeySuggestion.Nearest(token, options) is { } option)
                    yield return $"'{token}' is not an option of '{command.Name}'; did you mean '{option}'?";
            }
            else if (command.Subcommands.Count > 0 && KeySuggestion.Nearest(token, command.Subcommands.Select(c => c.Name)) is { } name)
                yield return $"'{token}' is not a command; did you mean '{name}'?";
        }
    }
}
