namespace ThermVerify.Simulation.Mna;

/// <summary>One extra MNA unknown an element adds: a branch current or an internal node voltage.</summary>
internal readonly record struct Unknown(string Label, bool IsCurrent)
{
    public static Unknown Current(string label) => new(label, true);

    public static Unknown Voltage(string label) => new(label, false);
}
