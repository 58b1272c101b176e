using System.Numerics;

namespace ThermVerify.Simulation;

/// <summary>
/// The loop gain T(f) over a sweep, with the crossover (|T| = 1, refined by bisection on log f between
/// the bracketing sweep points) and the phase margin 180° + ∠T(f_c), phase unwrapped from the low end.
/// </summary>
internal sealed class LoopGainResult
{
    internal LoopGainResult(double[] frequencies, Complex[] gain, Func<double, Complex> evaluate, IReadOnlyList<SimulationWarning> warnings)
    {
        FrequenciesHertz = frequencies;
        Gain = gain;
        Warnings = warnings;
        var phase = AcResult.PhaseDegrees(gain);
        for (var k = 1; k < gain.Length; k++)
        {
            if (gain[k - 1].Magnitude >= 1 && gain[k].Magnitude < 1)
            {
                double lo = Math.Log(frequencies[k - 1]), hi = Math.Log(frequencies[k]);
                for (var i = 0; i < 100 && hi - lo > 1e-13; i++)
                {
                    var mid = 0.5 * (lo + hi);
                    if (evaluate(Math.Exp(mid)).Magnitude >= 1) lo = mid; else hi = mid;
                }
                var fc = Math.Exp(0.5 * (lo + hi));
                var t = evaluate(fc);
                var p = t.Phase * 180 / Math.PI;
                p += 360 * Math.Round((phase[k - 1] - p) / 360);
                CrossoverHertz = fc;
                PhaseMarginDegrees = 180 + p;
                break;
            }
        }
    }

    public IReadOnlyList<double> FrequenciesHertz { get; }

    public IReadOnlyList<Complex> Gain { get; }

    public IReadOnlyList<SimulationWarning> Warnings { get; }

    public double[] MagnitudeDb => AcResult.Decibels(Gain);

    public double[] PhaseDegrees => AcResult.PhaseDegrees([.. Gain]);

    /// <summary>First frequency where |T| falls through 1; null if it never does inside the sweep.</summary>
    public double? CrossoverHertz { get; }

    public double? PhaseMarginDegrees { get; }
}
