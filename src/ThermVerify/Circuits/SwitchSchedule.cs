namespace ThermVerify.Circuits;

/// <summary>
/// When a <see cref="TimedSwitch"/> is closed. Intervals are half-open, [close, open): at an edge the
/// state of the step that ends there is the state before the edge. Every edge is a breakpoint.
/// </summary>
internal abstract record SwitchSchedule
{
    public abstract bool IsClosed(double timeSeconds);

    internal abstract void CollectEdges(double fromSeconds, double toSeconds, List<double> into);

    internal abstract void Validate(Element owner);
}
