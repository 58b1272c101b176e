using MathNet.Numerics.LinearAlgebra;
using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Mna;
using Complex = System.Numerics.Complex;

namespace ThermVerify.Tests.Differential;

/// <summary>The finite natural frequencies of a circuit linearised at its operating point.</summary>
internal sealed record Poles(IReadOnlyList<Complex> Values)
{
    /// <summary>Every pole in the open left half plane, none within 1e-9·|s| of the imaginary axis.</summary>
    public bool Stable => Values.All(s => s.Real < -1e-9 * s.Magnitude);

    /// <summary>1/|Re s| of the slowest pole (0 for a circuit without dynamics).</summary>
    public double SlowestSeconds => Values.Count == 0 ? 0 : Values.Max(s => 1 / Math.Abs(s.Real));

    public double FastestSeconds => Values.Count == 0 ? 0 : Values.Min(s => 1 / s.Magnitude);

    /// <summary>Period of the fastest oscillating pole (∞ when none oscillates).</summary>
    public double ShortestPeriodSeconds => Values.Where(s => Math.Abs(s.Imaginary) > 1e-9 * s.Magnitude)
        .Select(s => 2 * Math.PI / Math.Abs(s.Imaginary)).DefaultIfEmpty(double.PositiveInfinity).Min();
}

/// <summary>
/// Stability by eigenvalues: the poles are the finite roots of det(G + s·B) = 0, G the Jacobian at the operating
/// point and B the capacitances and inductances (the engine's own small-signal matrices). With a shift σ where
/// G + σB is regular, every eigenvalue λ ≠ 0 of M = (G + σB)⁻¹·B gives a pole s = σ − 1/λ; λ = 0 belongs to the
/// algebraic (infinite) part (shift-and-invert for a matrix pencil; Golub &amp; Van Loan §7.7, from memory). The
/// eigenvalues come from MathNet.Numerics (an independent implementation).
/// </summary>
internal static class StabilityScreen
{
    public static Poles PolesOf(Circuit circuit)
    {
        var system = new SmallSignalSystem(circuit, "Stability screen");
        var n = system.Size;
        var g = Matrix<double>.Build.Dense(n, n, (i, j) => system.Conductances[i * n + j]);
        var b = Matrix<double>.Build.Dense(n, n, (i, j) => system.Reactances[i * n + j]);
        if (!g.Enumerate().All(double.IsFinite) || !b.Enumerate().All(double.IsFinite))
            throw new InvalidOperationException("The circuit linearised at its operating point has entries that are not finite.");
        if (b.FrobeniusNorm() == 0)
            return new Poles([]);
        foreach (var sigma in new[] { 1e3, 3.7e5, 1.3e8, 17.0 })
        {
            var shifted = g + sigma * b;
            var lu = shifted.LU();
            // The 1-norm condition number from the inverse, not MathNet's ConditionNumber(): its managed SVD did not
            // return on the pencil of the circuit after seed 761, which stalled the large run for hours.
            if (lu.Determinant == 0 || !double.IsFinite(lu.Determinant) || shifted.L1Norm() * lu.Inverse().L1Norm() is not (< 1e14 and >= 1))
                continue;
            var m = lu.Solve(b);
            var lambdas = m.Evd().EigenValues;
            var largest = lambdas.Max(l => l.Magnitude);
            var poles = lambdas.Where(l => l.Magnitude > 1e-13 * largest).Select(l => sigma - 1 / l).ToList();
            return new Poles(poles);
        }
        throw new InvalidOperationException("No shift makes G + σB regular; the circuit has no determined small-signal response.");
    }

    /// <summary>Most combinations screened by <see cref="FirstUnstableCombination"/> (2⁸: eight switches and limited
    /// op-amps in all their combinations; beyond that a seeded sample of this many).</summary>
    public const int MaxCombinations = 256;

    /// <summary>
    /// The first combination of switch states and op-amp regions in which the linearised circuit is unstable (a
    /// description), or null when every screened one is stable. The operating point's own state and its flip (the
    /// screen of <see cref="DifferentialCase"/>) are not enough: differential seed 1103 is stable there, but unstable with S1
    /// closed and the other two switches open, and with U1 saturated (two VCVS and a VCCS then form a loop), and its
    /// transient runs away in both engines (ngspice to 1e6 V, the engine's step collapsing at 0.27 ms with nodes at 1e13 V). So every switch is taken open
    /// and closed, and every op-amp with a finite swing or slew rate in its linear region and saturated — there its
    /// output no longer follows its inputs, which the screen models as a gain of 1e-12 with the same pole (C_p and R_p
    /// unchanged). A combination whose operating point or poles cannot be found is not judged.
    /// </summary>
    public static string? FirstUnstableCombination(Circuit circuit, int seed)
    {
        var switches = circuit.Elements.OfType<TimedSwitch>().Select(e => e.Name).ToList();
        var limited = circuit.Elements.OfType<OpAmp>()
            .Where(a => double.IsFinite(a.OutputHighVolts) || double.IsFinite(a.OutputLowVolts) || double.IsFinite(a.SlewRateVoltsPerSecond))
            .Select(a => a.Name).ToList();
        var bits = switches.Count + limited.Count;
        if (bits == 0)
            return null;
        IEnumerable<long> masks = bits <= 8
            ? Enumerable.Range(0, 1 << bits).Select(m => (long)m)
            : SampledMasks(bits, seed);
        foreach (var mask in masks)
        {
            var closed = switches.Where((_, i) => (mask >> i & 1) == 1).ToHashSet();
            var saturated = limited.Where((_, i) => (mask >> (switches.Count + i) & 1) == 1).ToHashSet();
            var variant = new Circuit(circuit.Elements.Select(e => e switch
            {
                TimedSwitch sw => sw with { Schedule = closed.Contains(sw.Name) ? new IntervalSchedule((0, 1e9)) : new IntervalSchedule((1e9, 2e9)) },
                OpAmp a when saturated.Contains(a.Name) => a with { OpenLoopGain = 1e-12, GainBandwidthHertz = a.GainBandwidthHertz / a.OpenLoopGain * 1e-12 },
                _ => e,
            }), circuit.TemperatureCelsius);
            Poles poles;
            try
            {
                poles = PolesOf(variant);
            }
            catch (Exception e) when (e is SimulationException or InvalidOperationException or CircuitException)
            {
                continue;
            }
            if (!poles.Stable)
                return $"unstable with {(closed.Count == 0 ? "every switch open" : "closed " + string.Join(", ", closed))}" +
                       $"{(switches.Count > closed.Count && closed.Count > 0 ? ", the others open" : "")}" +
                       $"{(saturated.Count == 0 ? "" : "; saturated " + string.Join(", ", saturated))}";
        }
        return null;
    }

    private static IEnumerable<long> SampledMasks(int bits, int seed)
    {
        var random = new Random(seed);
        for (var k = 0; k < MaxCombinations; k++)
            yield return random.NextInt64(1L << Math.Min(bits, 62));
    }

    /// <summary>
    /// The circuit with every switch flipped to the state opposite its state at t = 0 (for a second screen).
    /// </summary>
    public static Circuit WithSwitchesFlipped(Circuit circuit) =>
        new(circuit.Elements.Select(e => e is TimedSwitch s
            ? s with { Schedule = s.Schedule.IsClosed(0) ? new IntervalSchedule((1e9, 2e9)) : new IntervalSchedule((0, 1e9)) }
            : e), circuit.TemperatureCelsius);
}
