namespace ThermVerify.Tests.Reporting;

/// <summary>
/// A fact that needs headless Chromium. Skipped with a visible reason where it is missing, unless
/// THERMVERIFY_REQUIRE_CHROMIUM=1 (set by .ci/run), where a missing browser fails the test instead.
/// </summary>
public sealed class ChromiumFactAttribute : FactAttribute
{
    public const string Path = "/usr/bin/chromium";

    public ChromiumFactAttribute()
    {
        if (Required || File.Exists(Path)) return;
        Skip = "chromium is not installed (apt-get install chromium); set THERMVERIFY_REQUIRE_CHROMIUM=1 to fail instead";
    }

    public static bool Required => Environment.GetEnvironmentVariable("THERMVERIFY_REQUIRE_CHROMIUM") == "1";
}
