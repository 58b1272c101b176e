using ThermVerify.Ngspice;

namespace ThermVerify.Tests.Ngspice;

/// <summary>A theory that needs ngspice: skipped or failing exactly as <see cref="NgspiceFactAttribute"/>.</summary>
public sealed class NgspiceTheoryAttribute : TheoryAttribute
{
    public NgspiceTheoryAttribute()
    {
        if (NgspiceFactAttribute.Required) return;
        if (!NgspiceLibrary.IsAvailable || !NgspiceProcess.IsAvailable)
            Skip = "ngspice is not installed (apt-get install ngspice libngspice0); set THERMVERIFY_REQUIRE_NGSPICE=1 to fail instead";
    }
}
