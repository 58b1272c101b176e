using ThermVerify.Ngspice;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// A fact that needs ngspice. On a machine without it the test is skipped with a visible reason, unless
/// THERMVERIFY_REQUIRE_NGSPICE=1 (set by .ci/run), where a missing engine must fail instead.
/// </summary>
public sealed class NgspiceFactAttribute : FactAttribute
{
    public NgspiceFactAttribute()
    {
        if (Required) return;
        if (!NgspiceLibrary.IsAvailable || !NgspiceProcess.IsAvailable)
            Skip = "ngspice is not installed (apt-get install ngspice libngspice0); set THERMVERIFY_REQUIRE_NGSPICE=1 to fail instead";
    }

    public static bool Required => Environment.GetEnvironmentVariable("THERMVERIFY_REQUIRE_NGSPICE") == "1";
}
