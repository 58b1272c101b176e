using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The large differential run: skipped with a visible reason unless THERMVERIFY_DIFFERENTIAL gives the number of
/// circuits (it takes minutes to hours), and skipped like any <see cref="NgspiceFactAttribute"/> without ngspice.
/// </summary>
public sealed class DifferentialLargeRunFactAttribute : FactAttribute
{
    public const string CountVariable = "THERMVERIFY_DIFFERENTIAL";

    public DifferentialLargeRunFactAttribute()
    {
        if (!int.TryParse(Environment.GetEnvironmentVariable(CountVariable), out var count) || count <= 0)
            Skip = $"the large differential run is on request: set {CountVariable} to the number of circuits (e.g. 3000)";
        else if (new NgspiceFactAttribute().Skip is { } reason)
            Skip = reason;
    }
}
