namespace ThermVerify.Simulation.Mna;

/// <summary>
/// A smooth clamp of v into [low, high]: f(v) = low + w·sp((v − low)/w) − w·sp((v − high)/w) with the
/// softplus sp(x) = ln(1 + eˣ). Its slope runs smoothly from 1 inside to 0 beyond either limit, so Newton
/// sees no corner; w sets how sharp the knee is. Far inside, f(v) − v is of order w·e^(−d/w).
/// </summary>
internal static class SoftClamp
{
    public static double Value(double v, double low, double high, double width)
    {
        var result = v;
        if (double.IsFinite(low))
            result = low + width * Softplus((v - low) / width);
        if (double.IsFinite(high))
            result -= width * Softplus((v - high) / width);
        return result;
    }

    public static double Slope(double v, double low, double high, double width)
    {
        var slope = double.IsFinite(low) ? Logistic((v - low) / width) : 1;
        if (double.IsFinite(high))
            slope -= Logistic((v - high) / width);
        return slope;
    }

    private static double Softplus(double x) => x > 30 ? x + Math.Exp(-x) : x < -30 ? Math.Exp(x) : Math.Log(1 + Math.Exp(x));

    private static double Logistic(double x) => x >= 0 ? 1 / (1 + Math.Exp(-x)) : Math.Exp(x) / (1 + Math.Exp(x));
}
