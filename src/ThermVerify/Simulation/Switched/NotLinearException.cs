namespace ThermVerify.Simulation.Switched;

/// <summary>
/// Where a circuit leaves the region in which its linear model holds: which element, which condition, the interval
/// [<see cref="FromSeconds"/>, <see cref="ToSeconds"/>] between two switch edges (or a requested time) in which it
/// happened, the worst checked instant and the value there against its allowed range.
/// </summary>
public sealed record LinearityViolation(
    string Element,
    string Condition,
    double FromSeconds,
    double ToSeconds,
    double AtSeconds,
    double Value,
    double Low,
    double High);

/// <summary>
/// Exact propagation cannot be used here, and the time-stepping engine (<see cref="TransientSimulation"/>) can.
/// Either the circuit itself is outside what exact propagation handles (<see cref="Violation"/> is null: a
/// nonlinear element other than the op-amp macro-model, a source that is not DC, a switch schedule that is not
/// periodic), or an op-amp left its linear region on one interval (<see cref="Violation"/> says where).
/// </summary>
public sealed class NotLinearException : SimulationException
{
    public NotLinearException(string message, string? element, LinearityViolation? violation = null) : base(message)
    {
        Element = element;
        Violation = violation;
    }

    /// <summary>The element that is the reason, when one is.</summary>
    public string? Element { get; }

    /// <summary>The interval on which an op-amp left its linear region; null when the circuit as a whole is unsupported.</summary>
    public LinearityViolation? Violation { get; }

    internal static NotLinearException Unsupported(string? element, string what) =>
        new($"Exact propagation cannot simulate this circuit: {what}. Use the time-stepping transient (TransientSimulation) for it.", element);

    internal static NotLinearException Leaves(LinearityViolation v) =>
        new($"{v.Element} leaves its linear region between t = {v.FromSeconds:G9} s and {v.ToSeconds:G9} s: {v.Condition} is {v.Value:G4} " +
            $"at t = {v.AtSeconds:G9} s, outside {v.Low:G4} … {v.High:G4}. Simulate this interval with the time-stepping transient " +
            "(TransientSimulation), or loosen ExactSwitchedOptions.LinearityToleranceVolts if the deviation is acceptable.", v.Element, v);
}
