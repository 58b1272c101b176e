namespace ThermVerify.Circuits;

/// <summary>
/// Time dependence of an independent source. Values are left-continuous at corners, so a step that ends
/// exactly on a corner still sees the value before it; every corner is reported as a breakpoint.
/// </summary>
internal abstract record Waveform
{
    public abstract double ValueAt(double timeSeconds);

    internal abstract void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into);

    internal abstract void Validate(Element owner);

    /// <summary>The SPICE source specification (DC, PULSE or PWL).</summary>
    internal abstract string ToSpice();

    public static implicit operator Waveform(double dc) => new DcWaveform(dc);
}

/// <summary>A constant value.</summary>
internal sealed record DcWaveform(double Value) : Waveform
{
    public override double ValueAt(double timeSeconds) => Value;

    internal override void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into) { }

    internal override string ToSpice() => $"dc {Spice.SpiceNumber.Format(Value)}";

    internal override void Validate(Element owner) => ElementChecks.Finite(owner, Value, "DC value");
}
