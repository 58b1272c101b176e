namespace ThermVerify.Simulation;

/// <summary>
/// A condition the analysis noticed but that does not stop it, e.g. an op-amp input outside its
/// common-mode range. <see cref="Subject"/> says which part of the element (a pin, a node);
/// <see cref="TimeSeconds"/> or <see cref="SweepValue"/> say where it was first seen.
/// </summary>
internal sealed record SimulationWarning(string Element, string Subject, string Message, double? TimeSeconds = null, double? SweepValue = null);
