namespace ThermVerify.Files;

/// <summary>
/// A file cannot be read safely: it is not a regular file, lies (or leads) outside its folder, is too large, or has
/// more than one name. <see cref="Problem"/> completes "the file …" and <see cref="Hint"/> says what fixes it; the
/// design loader turns it into an error at the key that names the file.
/// </summary>
public sealed class InputFileException(string problem, string hint) : IOException($"{problem}. {hint}")
{
    public string Problem { get; } = problem;

    public string Hint { get; } = hint;
}
