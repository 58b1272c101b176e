namespace ThermVerify.Circuits;

/// <summary>
/// An engine was asked for something it cannot do: the built-in engine and a user's SPICE subcircuit, or a SPICE
/// deck and an element without a SPICE form. The message names the element and the way round it.
/// </summary>
public sealed class EngineUnsupportedException(string message) : Exception(message);
