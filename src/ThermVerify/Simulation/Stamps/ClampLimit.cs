namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// Newton step limiting for the op-amp's output clamp (<see cref="Mna.SoftClamp"/>), in the spirit of SPICE's junction
/// limiting (pnjlim; Nagel 1975, from memory): beyond a rail the clamp's slope dies as e^(−d/w) with the overdrive d, so
/// a linearisation there opens the loop and the next iterate lands on the far side of the other rail. The rules, with
/// L and H the rails and w the knee:
/// <list type="bullet">
/// <item>a step that crosses the whole linear range lands one knee inside the rail it heads for (slope ≈ 0.73 there,
/// so the loop is closed again in the next linearisation);</item>
/// <item>a step from the linear range to beyond a rail goes there logarithmically, H + w·ln(1 + d/w), as pnjlim
/// takes a junction voltage beyond its critical value;</item>
/// <item>steps within the linear range, steps deeper into the same saturation (where the clamp is flat and Newton
/// converges at once) and steps of at most two knees are taken as they are.</item>
/// </list>
/// </summary>
internal static class ClampLimit
{
    public static double Apply(double next, double previous, double low, double high, double knee)
    {
        // As pnjlim, steps of less than two knees are never limited: near a rail Newton converges as it is.
        if (Math.Abs(next - previous) <= 2 * knee)
            return next;
        if (next > high && previous <= high)
            return previous < low ? high - knee : high + knee * Math.Log(1 + (next - high) / knee);
        if (next < low && previous >= low)
            return previous > high ? low + knee : low - knee * Math.Log(1 + (low - next) / knee);
        return next;
    }
}
