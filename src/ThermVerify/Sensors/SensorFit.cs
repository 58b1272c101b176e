namespace ThermVerify.Sensors;

/// <summary>A fitted model and how well it reproduces the points it was fitted to.</summary>
/// <param name="ResidualsKelvin">Model temperature minus given temperature at each input point, in input order.</param>
internal sealed record SensorFit<TModel>(TModel Model, IReadOnlyList<double> ResidualsKelvin) where TModel : ISensorModel
{
    public double MaxAbsResidualKelvin => ResidualsKelvin.Max(Math.Abs);
}

/// <summary>Points that cannot be fitted: too few, duplicated, or physically impossible. Says which and why.</summary>
public sealed class SensorFitException(string message, string? paramName = null) : ArgumentException(message, paramName);
