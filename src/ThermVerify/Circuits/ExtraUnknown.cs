namespace ThermVerify.Circuits;

/// <summary>
/// An unknown an element adds beside its nodes: a branch current (voltage sources, inductors, controlled voltage
/// sources) or an internal node. Every nodal engine numbers these; the label names it in messages and results.
/// </summary>
internal readonly record struct ExtraUnknown(string Label, bool IsCurrent)
{
    public static ExtraUnknown Current(string label) => new(label, true);

    public static ExtraUnknown Voltage(string label) => new(label, false);
}
