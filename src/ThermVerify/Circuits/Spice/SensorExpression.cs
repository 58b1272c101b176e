using System.Text;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using static ThermVerify.Circuits.Spice.SpiceNumber;

namespace ThermVerify.Circuits.Spice;

/// <summary>
/// A sensor model as a SPICE expression in <c>temper</c> (the circuit temperature in °C), for a resistor written
/// <c>r='…'</c>: SPICE re-evaluates it at every point of a <c>.dc temp</c> sweep. Each expression is the model's own
/// closed form, so both engines compute the same resistance to rounding.
/// </summary>
internal static class SensorExpression
{
    private static readonly string Kelvin = $"(temper+{Format(PhysicalConstants.ZeroCelsiusInKelvin)})";

    public static string For(ISensorModel sensor) => sensor switch
    {
        BetaThermistor b => Beta(b),
        SteinhartHartThermistor s => SteinhartHart(s),
        PlatinumRtd r => CallendarVanDusen(r),
        TableThermistor t => Table(t),
        _ => throw new EngineUnsupportedException(
            $"The sensor model '{sensor.Description}' has no SPICE form; use a Beta, Steinhart–Hart, R–T table or RTD model for SPICE export."),
    };

    /// <summary>R0·exp(β·(1/T − 1/T0)).</summary>
    private static string Beta(BetaThermistor b) =>
        $"{Format(b.R0Ohms)}*exp({Format(b.Beta)}*(1/{Kelvin}-{Format(1 / PhysicalConstants.ToKelvin(b.T0Celsius))}))";

    /// <summary>
    /// R = exp(x) with x the real root of A + B x + C x³ = 1/T (closed form, the same as the model's starting point:
    /// y = (A − 1/T)/C, s = √((B/3C)³ + y²/4), x = ∛(s − y/2) − ∛(s + y/2); both radicands are positive, so pow is safe).
    /// With a D term there is no closed form: three Newton steps from that root follow, as in the model.
    /// </summary>
    private static string SteinhartHart(SteinhartHartThermistor s)
    {
        if (s.C <= 0)
            throw new EngineUnsupportedException(
                $"Steinhart–Hart coefficient C = {s.C} is not positive; its SPICE form needs C > 0 (the usual NTC case).");
        var y = $"(({Format(s.A)}-1/{Kelvin})/{Format(s.C)})";
        var b3c = Format(s.B / (3 * s.C));
        var root = $"sqrt(pow({b3c},3)+{y}*{y}/4)";
        var x = $"(pow({root}-{y}/2,1/3)-pow({root}+{y}/2,1/3))";
        if (s.D == 0)
            return $"exp({x})";
        for (var step = 0; step < 3; step++)
            x = $"({x}-({Format(s.A)}+{x}*({Format(s.B)}+{x}*({Format(s.D)}+{x}*{Format(s.C)}))-1/{Kelvin})/({Format(s.B)}+{x}*(2*{Format(s.D)}+3*{Format(s.C)}*{x})))";
        return $"exp({x})";
    }

    /// <summary>IEC 60751: R0·(1 + A t + B t² + C (t − 100) t³), the C term only below 0 °C.</summary>
    private static string CallendarVanDusen(PlatinumRtd r) =>
        $"{Format(r.R0Ohms)}*(1+temper*({Format(r.CoefficientA)}+temper*{Format(r.CoefficientB)})" +
        $"+(temper<0 ? {Format(r.CoefficientC)}*(temper-100)*temper*temper*temper : 0))";

    /// <summary>
    /// The table's monotone cubic in ln R against u = 1/T, written as nested conditionals that pick the segment and a
    /// cubic in (u − u_k) per segment (Horner form); outside the table the end segments continue, as in the model.
    /// Chosen over a B-source table because a resistor expression keeps the sensor a resistor (its noise included).
    /// </summary>
    private static string Table(TableThermistor t)
    {
        var cubic = t.LnResistanceOfInverseKelvin;
        var (x, v, m) = (cubic.Knots, cubic.Values, cubic.Slopes);
        var u = $"(1/{Kelvin})";
        var text = new StringBuilder("exp(");
        for (var k = 0; k < x.Count - 1; k++)
        {
            var h = x[k + 1] - x[k];
            var delta = (v[k + 1] - v[k]) / h;
            // Hermite cubic on [x_k, x_k+1] as c0 + c1 d + c2 d² + c3 d³, d = u − x_k.
            var c2 = (3 * delta - 2 * m[k] - m[k + 1]) / h;
            var c3 = (m[k] + m[k + 1] - 2 * delta) / (h * h);
            var d = $"({u}-{Format(x[k])})";
            var segment = $"{Format(v[k])}+{d}*({Format(m[k])}+{d}*({Format(c2)}+{d}*{Format(c3)}))";
            if (k < x.Count - 2)
                text.Append($"({u}<{Format(x[k + 1])} ? {segment} : ");
            else
                text.Append(segment);
        }
        text.Append(')', x.Count - 2);
        text.Append(')');
        return text.ToString();
    }
}
