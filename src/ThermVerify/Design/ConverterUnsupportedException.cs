namespace ThermVerify.Design;

/// <summary>
/// An analysis was asked of a converter it does not model; refused rather than treated as the other kind, with the
/// analysis, the converter and what to run instead in the message. Bad input (exit code 2). Every analysis handles
/// both kinds of converter at present, so none raises it; it stays for embedding programs that catch it.
/// </summary>
public sealed class ConverterUnsupportedException(string message) : Exception(message);
