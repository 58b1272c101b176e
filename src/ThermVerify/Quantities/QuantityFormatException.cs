namespace ThermVerify.Quantities;

/// <summary>
/// A value could not be read. <see cref="Exception.Message"/> quotes the text, says what is wrong and ends
/// with <see cref="Hint"/>, which says what to write instead.
/// </summary>
public sealed class QuantityFormatException : FormatException
{
    public QuantityFormatException(string text, string problem, string hint)
        : base($"\"{text}\": {problem}. {hint}")
    {
        Text = text;
        Problem = problem;
        Hint = hint;
    }

    /// <summary>The text as given.</summary>
    public string Text { get; }

    /// <summary>What is wrong, without the quoted text or hint.</summary>
    public string Problem { get; }

    /// <summary>What would fix it.</summary>
    public string Hint { get; }
}
