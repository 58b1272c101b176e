using MathNet.Numerics.LinearAlgebra;
using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>
/// The automatic switch from the trapezoidal rule to Gear-2 when the rule rings on a stiff circuit. The circuit: a 1 V
/// ramp over 1 ms through 1 Ω onto 1 nF (a 1 ns mode), and from there 1 MΩ onto 1 µF (a 1 s mode), run for 5 s. After
/// the ramp's corner the step grows to milliseconds, a million times the fast mode, where the trapezoidal rule's
/// amplification of that mode is about −1 (A-stable, not L-stable; Hairer &amp; Wanner, Solving ODEs II, §IV.3, from
/// memory): whatever error the corner left on the 1 nF rings from step to step without dying away.
/// </summary>
public class Gear2SwitchTests
{
    private const double R1 = 1, C1 = 1e-9, R2 = 1e6, C2 = 1e-6, RampSeconds = 1e-3, StopSeconds = 5;

    private static readonly Circuit Ladder = new CircuitBuilder()
        .VoltageSource("V1", "in", "0", new PiecewiseLinearWaveform((0, 0), (RampSeconds, 1)))
        .Resistor("R1", "in", "a", R1)
        .Capacitor("C1", "a", "0", C1)
        .Resistor("R2", "a", "b", R2)
        .Capacitor("C2", "b", "0", C2)
        .Build();

    /// <summary>
    /// The exact supply current. The ladder is x' = A·x + b·u(t) with x = (v_a, v_b); for the ramp u = t/T from rest the
    /// solution is α·t + β − e^(At)·β with A·α = −b/T and A·β = α, and after the ramp, with u = 1, it relaxes from
    /// there towards x∞ = −A⁻¹·b as x∞ + e^(A(t−T))·(x(T) − x∞) (linear ODEs with constant coefficients, any
    /// circuit-analysis text, from memory; e^(At) through MathNet's eigendecomposition).
    /// </summary>
    private static double ExactSupplyCurrent(double t)
    {
        var a = Matrix<double>.Build.DenseOfArray(new[,]
        {
            { -(1 / R1 + 1 / R2) / C1, 1 / (R2 * C1) },
            { 1 / (R2 * C2), -1 / (R2 * C2) },
        });
        var b = Vector<double>.Build.DenseOfArray([1 / (R1 * C1), 0]);
        var evd = a.Evd();
        var vectors = evd.EigenVectors;
        var inverse = vectors.Inverse();
        Matrix<double> Exp(double s) =>
            vectors * Matrix<double>.Build.DenseOfDiagonalArray(evd.EigenValues.Select(l => Math.Exp(l.Real * s)).ToArray()) * inverse;
        var alpha = -a.Solve(b) / RampSeconds;
        var beta = a.Solve(alpha);
        var final = -a.Solve(b);
        var atCorner = alpha * RampSeconds + beta - Exp(RampSeconds) * beta;
        var x = t <= RampSeconds ? alpha * t + beta - Exp(t) * beta : final + Exp(t - RampSeconds) * (atCorner - final);
        return (Math.Min(t / RampSeconds, 1) - x[0]) / R1;
    }

    /// <summary>Largest error of the current drawn from V1 at the points after 2 ms (a millisecond past the corner).</summary>
    private static double WorstCurrentErrorAfterTheCorner(TransientResult result)
    {
        var times = result.TimesSeconds;
        // The branch current of a source flows into its positive terminal: the supply current is its negative.
        var supply = result.Current("V1").Select(i => -i).ToArray();
        var worst = 0.0;
        for (var i = 0; i < times.Length; i++)
            if (times[i] > 2 * RampSeconds)
                worst = Math.Max(worst, Math.Abs(supply[i] - ExactSupplyCurrent(times[i])));
        return worst;
    }

    [Fact]
    public void Automatic_switches_to_gear2_when_the_trapezoidal_rule_rings_and_says_so()
    {
        var result = Transient.Run(Ladder, new TransientOptions { StopTimeSeconds = StopSeconds, Method = IntegrationMethod.Automatic });
        var note = Assert.Single(result.Notes);
        Assert.Contains("C1", note.Message);
        Assert.Contains("Gear-2", note.Message);
        Assert.NotNull(note.TimeSeconds);
        Assert.InRange(note.TimeSeconds!.Value, RampSeconds, 2 * RampSeconds);
    }

    [Fact]
    public void After_the_switch_the_supply_current_is_exact_where_the_trapezoidal_rule_keeps_ringing()
    {
        var automatic = WorstCurrentErrorAfterTheCorner(
            Transient.Run(Ladder, new TransientOptions { StopTimeSeconds = StopSeconds, Method = IntegrationMethod.Automatic }));
        var trapezoidal = WorstCurrentErrorAfterTheCorner(
            Transient.Run(Ladder, new TransientOptions { StopTimeSeconds = StopSeconds, Method = IntegrationMethod.Trapezoidal }));
        // The current after the corner is about 1 µA decaying over seconds; the default reltol is 1e-6, and Gear-2 damps the
        // fast mode, so 1e-10 A (1e-4 of it) holds with room (measured 3e-11 A). The trapezoidal rule's ringing stays
        // several times larger (measured 8e-10 A).
        Assert.True(automatic <= 1e-10, $"automatic: worst current error {automatic:G3} A");
        Assert.True(trapezoidal > 3 * automatic, $"trapezoidal {trapezoidal:G3} A against automatic {automatic:G3} A");
    }
}
