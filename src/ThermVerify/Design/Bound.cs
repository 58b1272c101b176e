namespace ThermVerify.Design;

/// <summary>Which sign a value may have.</summary>
internal enum Bound
{
    Any,
    /// <summary>Zero allowed (zero usually means "absent" or "ideal").</summary>
    NonNegative,
    Positive,
}
