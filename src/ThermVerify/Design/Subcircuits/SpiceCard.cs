namespace ThermVerify.Design.Subcircuits;

internal enum SpiceTokenKind { Word, Equals, Open, Close, Comma, Expression, Quoted }

/// <summary>One token of a subcircuit file with its 1-based position.</summary>
internal readonly record struct SpiceToken(SpiceTokenKind Kind, string Text, int Line, int Column)
{
    public bool IsWord(string lowerCase) => Kind == SpiceTokenKind.Word && Text.Equals(lowerCase, StringComparison.OrdinalIgnoreCase);
}

/// <summary>One logical line of a SPICE file (its continuation lines joined), as tokens.</summary>
internal sealed record SpiceCard(IReadOnlyList<SpiceToken> Tokens)
{
    public SpiceToken First => Tokens[0];
}
