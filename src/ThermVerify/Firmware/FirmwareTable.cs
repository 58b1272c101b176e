namespace ThermVerify.Firmware;

/// <summary>
/// A code-to-temperature table as firmware stores it: breakpoint codes (strictly rising) and fixed-point values.
/// A dense table has a breakpoint at every code of the span and is read by index; a sparse one is interpolated.
/// Codes outside the span read as the nearest end value (<see cref="IsClamped"/> tells firmware code apart).
/// </summary>
public sealed record FirmwareTable
{
    public FirmwareTable(CodeSpan span, FixedPointScale scale, IReadOnlyList<int> codes, IReadOnlyList<int> values)
    {
        ArgumentNullException.ThrowIfNull(span);
        if (codes.Count != values.Count || codes.Count < 2)
            throw new FirmwareInputException($"A table needs at least two breakpoints and one value per code; got {codes.Count} codes and {values.Count} values.");
        if (codes[0] != span.FirstCode || codes[^1] != span.LastCode)
            throw new FirmwareInputException($"The breakpoints run from code {codes[0]} to {codes[^1]} but the span is {span.FirstCode} to {span.LastCode}; the ends must match.");
        for (var i = 1; i < codes.Count; i++)
        {
            if (codes[i] <= codes[i - 1])
                throw new FirmwareInputException($"Breakpoint {i} (code {codes[i]}) does not rise above breakpoint {i - 1} (code {codes[i - 1]}); codes must strictly rise.");
            if (!FixedPointInterpolation.FitsInt32(codes[i - 1], values[i - 1], codes[i], values[i]))
                throw new FirmwareInputException($"The segment from code {codes[i - 1]} to {codes[i]} overflows 32-bit interpolation; add breakpoints or use a coarser unit.");
        }
        Span = span;
        Scale = scale;
        Codes = [.. codes];
        Values = [.. values];
    }

    public CodeSpan Span { get; }
    public FixedPointScale Scale { get; }
    public IReadOnlyList<int> Codes { get; }
    public IReadOnlyList<int> Values { get; }

    public bool IsDense => Codes.Count == Span.Count;

    public bool IsClamped(int code) => !Span.Contains(code);

    /// <summary>The fixed-point temperature the reference C routine returns for <paramref name="code"/>.</summary>
    public int Evaluate(int code)
    {
        if (code <= Span.FirstCode) return Values[0];
        if (code >= Span.LastCode) return Values[^1];
        if (IsDense) return Values[code - Span.FirstCode];
        int lo = 0, hi = Codes.Count - 1;
        while (hi - lo > 1)
        {
            int mid = lo + (hi - lo) / 2;
            if (Codes[mid] <= code) lo = mid; else hi = mid;
        }
        return FixedPointInterpolation.Interpolate(Codes[lo], Values[lo], Codes[hi], Values[hi], code);
    }

    public double EvaluateCelsius(int code) => Scale.ToCelsius(Evaluate(code));

    /// <summary>True when every value fits a C int16_t, so the header can store them in half the space.</summary>
    public bool FitsInt16 => Values.All(v => v is >= short.MinValue and <= short.MaxValue);
}
