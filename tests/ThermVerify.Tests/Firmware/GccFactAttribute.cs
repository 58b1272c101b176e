namespace ThermVerify.Tests.Firmware;

/// <summary>
/// A fact that needs a C compiler. Without gcc on the PATH the test is skipped with a visible reason, unless
/// THERMVERIFY_REQUIRE_GCC=1 (set by .ci/run), where a missing compiler must fail instead.
/// </summary>
public sealed class GccFactAttribute : FactAttribute
{
    public GccFactAttribute()
    {
        if (Required || GccPath is not null) return;
        Skip = "gcc is not installed (apt-get install gcc); set THERMVERIFY_REQUIRE_GCC=1 to fail instead";
    }

    public static bool Required => Environment.GetEnvironmentVariable("THERMVERIFY_REQUIRE_GCC") == "1";

    public static string? GccPath =>
        (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator)
            .Select(dir => Path.Combine(dir, "gcc")).FirstOrDefault(File.Exists);
}
