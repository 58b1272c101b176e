namespace ThermVerify.Circuits.Spice;

/// <summary>
/// An output statement of a deck, so that a batch run (<c>ngspice -b deck.cir</c>) prints figures instead of nothing:
/// a table of vectors (<c>.print</c>) or one value read at an instant (<c>.meas</c>). Names are checked against a
/// plain character set, since they are written into the deck as they are.
/// </summary>
internal abstract record SpiceOutput
{
    public abstract string Line();

    protected static string Plain(string text, string what) =>
        text.Length > 0 && text.All(c => char.IsAsciiLetterOrDigit(c) || c is '_' or '#' or '(' or ')' or ',')
            ? text
            : throw new EngineUnsupportedException($"The {what} '{text}' is not plain enough to write into a SPICE output statement.");
}

/// <summary><c>.print KIND v1 v2 …</c>: a table of the vectors at every point of the analysis (KIND dc, tran, ac or noise).</summary>
internal sealed record PrintVectors(string Kind, IReadOnlyList<string> Vectors) : SpiceOutput
{
    public override string Line() => $".print {Plain(Kind, "analysis")} {string.Join(' ', Vectors.Select(v => Plain(v, "vector")))}";
}

/// <summary><c>.meas tran NAME find v(NODE) at=T</c>: the node's voltage at one instant of a transient.</summary>
internal sealed record MeasureAt(string Name, string Node, double TimeSeconds) : SpiceOutput
{
    public override string Line() => $".meas tran {Plain(Name, "measurement")} find v({Plain(Node, "node")}) at={SpiceNumber.Format(TimeSeconds)}";
}
