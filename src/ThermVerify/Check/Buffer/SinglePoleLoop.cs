using System.Numerics;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// The hand calculation of a buffer's loop gain into a capacitive load: a single-pole op-amp (GBW/jf) with feedback
/// factor β, whose output resistance r_o and the series resistance outside the loop (isolation plus filter resistor)
/// drive the load capacitance C_L. The output network divides the drive by (1 + jf/f_z)/(1 + jf/f_p) with
/// f_p = 1/(2π(r_o + R_s)C_L) and f_z = 1/(2π R_s C_L) (no zero without R_s), so
/// T(f) = β·(GBW/jf)·(1 + jf/f_z)/(1 + jf/f_p) and PM = 90° − atan(f_c/f_p) + atan(f_c/f_z)
/// (the standard single-pole results of op-amp design textbooks, from memory). It ignores the switch resistance in
/// series with the sampling capacitor and any second pole: a cross-check, not the verdict.
/// </summary>
public readonly record struct SinglePoleLoop(double GainBandwidthHertz, double OutputOhms, double SeriesOhms, double LoadFarads, double FeedbackFactor = 1)
{
    public double PoleHertz => 1 / (2 * Math.PI * (OutputOhms + SeriesOhms) * LoadFarads);

    public double ZeroHertz => SeriesOhms > 0 ? 1 / (2 * Math.PI * SeriesOhms * LoadFarads) : double.PositiveInfinity;

    public Complex Gain(double hertz)
    {
        var jf = new Complex(0, hertz);
        var network = LoadFarads > 0 ? (1 + jf / ZeroHertz) / (1 + jf / PoleHertz) : Complex.One;
        return FeedbackFactor * GainBandwidthHertz / jf * network;
    }

    /// <summary>|T(f_c)| = 1; |T| falls monotonically, so bisection on log f is exact to the precision asked.</summary>
    public double CrossoverHertz
    {
        get
        {
            double lo = Math.Log(1e-6 * GainBandwidthHertz * FeedbackFactor), hi = Math.Log(10 * GainBandwidthHertz * FeedbackFactor);
            for (var i = 0; i < 200 && hi - lo > 1e-14; i++)
            {
                var mid = 0.5 * (lo + hi);
                if (Gain(Math.Exp(mid)).Magnitude >= 1) lo = mid; else hi = mid;
            }
            return Math.Exp(0.5 * (lo + hi));
        }
    }

    public double PhaseMarginDegrees
    {
        get
        {
            var fc = CrossoverHertz;
            var zero = double.IsFinite(ZeroHertz) ? Math.Atan(fc / ZeroHertz) : 0;
            var pole = LoadFarads > 0 ? Math.Atan(fc / PoleHertz) : 0;
            return 90 - (pole - zero) * 180 / Math.PI;
        }
    }

    /// <summary>The smallest isolation resistance that brings the margin to the target (bisection on the closed form); null if none up to 1 MΩ does.</summary>
    public static double? IsolationFor(double targetDegrees, double gainBandwidthHertz, double outputOhms, double filterOhms, double loadFarads, double feedbackFactor = 1)
    {
        double Margin(double riso) => new SinglePoleLoop(gainBandwidthHertz, outputOhms, riso + filterOhms, loadFarads, feedbackFactor).PhaseMarginDegrees;
        if (Margin(0) >= targetDegrees) return 0;
        double lo = 1e-6, hi = 1e6;
        if (Margin(hi) < targetDegrees) return null;
        for (var i = 0; i < 200 && hi / lo > 1 + 1e-9; i++)
        {
            var mid = Math.Sqrt(lo * hi);
            if (Margin(mid) >= targetDegrees) hi = mid; else lo = mid;
        }
        return hi;
    }
}
