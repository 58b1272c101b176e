namespace ThermVerify.Design;

/// <summary>
/// Static errors a datasheet gives as a bound ("offset 1 mV") and errors the designer knows with their sign
/// ("+1 mV" measured on the board) are written alike, apart from the sign: a value written without a sign is a bound,
/// which the check takes at whichever sign makes the reading worse at each temperature; a value written with a sign
/// (+ or −) is taken at that sign. docs/design-file.md states the rule.
/// </summary>
internal static class SignWritten
{
    /// <summary>True when the key's text starts with a sign: the design states the value's sign.</summary>
    public static bool Of(TomlSection s, string key) =>
        s.String(key) is { } text && text.TrimStart() is { Length: > 0 } t && t[0] is '+' or '-' or '\u2212';
}
