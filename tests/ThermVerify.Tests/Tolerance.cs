namespace ThermVerify.Tests;

/// <summary>The project's one tolerance rule: |actual − expected| ≤ rel·max(|actual|, |expected|) + abs.</summary>
public static class Tolerance
{
    public static bool Within(double actual, double expected, double rel, double abs = 0) =>
        Math.Abs(actual - expected) <= rel * Math.Max(Math.Abs(actual), Math.Abs(expected)) + abs;

    public static void AssertClose(double expected, double actual, double rel, double abs = 0, string? what = null)
    {
        if (!Within(actual, expected, rel, abs))
            Assert.Fail($"{what ?? "value"}: expected {expected:R}, got {actual:R} (|Δ| = {Math.Abs(actual - expected):G4}, rel {rel:G3}, abs {abs:G3})");
    }
}
