namespace ThermVerify.Design;

/// <summary>
/// An analysis was asked of a converter it does not model (the transient deck of a buffered delta-sigma input, whose
/// settling is a closed-form single pole with no switched circuit). Refused rather than treated as another case: the
/// message names the analysis, the converter and what to run instead. Bad input (exit code 2).
/// </summary>
public sealed class ConverterUnsupportedException(string message) : Exception(message);
