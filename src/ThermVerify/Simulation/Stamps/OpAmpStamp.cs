using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// Op-amp macro-model in the matrix. Internal unknowns: the dominant-pole node (volts equal to the
/// unclamped output), an optional second-pole node, the drive node (clamped output before r_o) and the
/// drive source's current. The pole node is loaded by R_p = 1 kΩ ∥ C_p with g_m = A0/R_p and
/// C_p = A0/(2π·R_p·GBW), so A(f) = A0/(1 + j·f·A0/GBW); slewing caps the g_m current at SR·C_p through
/// a tanh, which leaves the small-signal gain unchanged. In DC the stage is linear (slewing is dynamic).
/// The clamp's input, and in transients the slewing input stage's differential voltage, are limited between Newton
/// iterations (<see cref="ClampLimit"/>), as SPICE limits junction voltages: beyond a rail the clamp is flat (beyond
/// a few I_max/g_m the tanh is), so an unlimited Newton step opens the feedback loop and throws the pole node from
/// one side to the other for ever.
/// </summary>
internal sealed class OpAmpStamp : Stamp
{
    private const double PoleOhms = 1e3;

    private readonly OpAmp amp;
    private readonly int plus, minus, output, pole, pole2, drive, driveCurrent, last;
    private readonly int poleSlot, pole2Slot, pole2FromPole, poleFromPlus, poleFromMinus, driveCurrentSlot, rowDrive, rowLast;
    private readonly ConductanceSlots outputSlots;
    private readonly double gm, poleConductance, poleCapacitance, secondConductance, secondCapacitance, maxCurrent;
    private readonly int poleState, pole2State;
    private double lastTransconductance;
    private double lastClampInput;
    private double linearisedAt;
    private bool linearisedSlewing;
    private double lastInputVolts;

    public OpAmpStamp(OpAmp amp, BindContext c) : base(amp)
    {
        this.amp = amp;
        plus = c.Node(amp.NonInverting);
        minus = c.Node(amp.Inverting);
        output = c.Node(amp.Output);
        var hasSecond = amp.SecondPoleHertz is not null;
        pole = c.Extra(0);
        pole2 = hasSecond ? c.Extra(1) : -1;
        drive = c.Extra(hasSecond ? 2 : 1);
        driveCurrent = c.Extra(hasSecond ? 3 : 2);
        last = hasSecond ? pole2 : pole;

        poleConductance = 1 / PoleOhms;
        gm = amp.OpenLoopGain / PoleOhms;
        poleCapacitance = amp.OpenLoopGain / (2 * Math.PI * PoleOhms * amp.GainBandwidthHertz);
        maxCurrent = amp.SlewRateVoltsPerSecond * poleCapacitance;
        poleSlot = c.Slot(pole, pole);
        poleFromPlus = c.Slot(pole, plus);
        poleFromMinus = c.Slot(pole, minus);
        poleState = c.State(isCurrent: false);
        if (hasSecond)
        {
            secondConductance = 1 / PoleOhms;
            secondCapacitance = 1 / (2 * Math.PI * PoleOhms * amp.SecondPoleHertz!.Value);
            pole2Slot = c.Slot(pole2, pole2);
            pole2FromPole = c.Slot(pole2, pole);
            pole2State = c.State(isCurrent: false);
        }
        driveCurrentSlot = c.Slot(drive, driveCurrent);
        rowDrive = c.Slot(driveCurrent, drive);
        rowLast = c.Slot(driveCurrent, last);
        outputSlots = new ConductanceSlots(c, drive, output);
        lastTransconductance = gm;
    }

    private bool Clamps => double.IsFinite(amp.OutputLowVolts) || double.IsFinite(amp.OutputHighVolts);

    private bool Slews => double.IsFinite(maxCurrent);

    public override bool HasLoad => true;

    public override bool IsNonlinear => Clamps || Slews;

    public override bool IsReactive => true;

    public override bool HasChecks => double.IsFinite(amp.CommonModeLowVolts) || double.IsFinite(amp.CommonModeHighVolts);

    /// <summary>The input stage's transconductance in its linear region, A0/R_p.</summary>
    public double LinearTransconductance => gm;

    /// <summary>Small-signal transconductance of the input stage at the last load.</summary>
    public double Transconductance => lastTransconductance;

    public override void LoadStatic(double[] m)
    {
        m[poleSlot] += poleConductance;
        if (pole2 >= 0)
        {
            m[pole2Slot] += secondConductance;
            m[pole2FromPole] -= secondConductance;
        }
        m[driveCurrentSlot] += 1;
        m[rowDrive] += 1;
        outputSlots.Add(m, 1 / amp.OutputResistanceOhms);
    }

    public override void Load(LoadContext c)
    {
        var x = c.Solution;
        var m = c.Matrix;

        // Input stage: i = g(vd) into the pole node, vd = V+ − V− + Vos; linearised as i0 + g·(vd − vd0).
        var vd = x[plus] - x[minus] + amp.InputOffsetVolts;
        double current, g;
        if (Slews && c.Mode == AnalysisMode.Transient)
        {
            // The tanh saturates beyond a few I_max/g_m: limited like the clamp, for the same reason.
            var knee = maxCurrent / gm;
            var limited = c.OpAmpLimiting ? ClampLimit.Apply(vd, lastInputVolts, -2 * knee, 2 * knee, knee) : vd;
            if (limited != vd)
                c.Limited = true;
            vd = limited;
            lastInputVolts = vd;
            var t = Math.Tanh(gm * vd / maxCurrent);
            current = maxCurrent * t;
            g = gm * (1 - t * t);
        }
        else
        {
            current = gm * vd;
            g = gm;
        }
        lastTransconductance = g;
        m[poleFromPlus] -= g;
        m[poleFromMinus] += g;
        c.Rhs[pole] += current - g * (vd - amp.InputOffsetVolts);

        // Pole capacitors (companion models; open in DC).
        if (c.Mode == AnalysisMode.Transient)
        {
            m[poleSlot] += poleCapacitance * c.Ag0;
            c.Rhs[pole] -= poleCapacitance * c.History(poleState);
            if (pole2 >= 0)
            {
                m[pole2Slot] += secondCapacitance * c.Ag0;
                c.Rhs[pole2] -= secondCapacitance * c.History(pole2State);
            }
        }

        // Drive: V(drive) = clamp(V(last)), linearised about the limited clamp input.
        var v = x[last];
        if (Clamps)
        {
            var limited = c.OpAmpLimiting ? ClampLimit.Apply(v, lastClampInput, amp.OutputLowVolts, amp.OutputHighVolts, amp.OutputKneeVolts) : v;
            if (limited != v)
                c.Limited = true;
            v = limited;
            lastClampInput = v;
        }
        linearisedAt = v;
        linearisedSlewing = Slews && c.Mode == AnalysisMode.Transient;
        var slope = SoftClamp.Slope(v, amp.OutputLowVolts, amp.OutputHighVolts, amp.OutputKneeVolts);
        var value = SoftClamp.Value(v, amp.OutputLowVolts, amp.OutputHighVolts, amp.OutputKneeVolts);
        m[rowLast] -= slope;
        c.Rhs[driveCurrent] += value - slope * v;

        // Bias currents flow into the pins.
        c.Rhs[plus] -= c.SourceFactor * amp.NonInvertingBiasAmperes;
        c.Rhs[minus] -= c.SourceFactor * amp.InvertingBiasAmperes;
    }

    /// <summary>
    /// Exact when the input stage is linear (no slew limit, or outside a transient, where the model's stage is g_m·v_d) and
    /// the clamp's input stays at least <see cref="AffineKnees"/> knee widths inside both swing limits at the point it was
    /// linearised at and at the new iterate: the soft clamp then departs from the identity by under w·e^(−40) per limit
    /// (4e-20 V for a 10 mV knee), so the linearised drive is the clamp itself far below any tolerance. This is the op-amp
    /// in its linear region; a sweep of such a circuit then costs one solve a point instead of two.
    /// </summary>
    public override bool LinearisationExact(LoadContext c, double[] next) =>
        !linearisedSlewing && Affine(linearisedAt) && Affine(next[last]);

    /// <summary>Knee widths from a swing limit beyond which the soft clamp counts as the identity.</summary>
    private const double AffineKnees = 40;

    private bool Affine(double v) =>
        !(v - amp.OutputLowVolts < AffineKnees * amp.OutputKneeVolts) && !(amp.OutputHighVolts - v < AffineKnees * amp.OutputKneeVolts);

    public override void Accept(LoadContext c)
    {
        c.Integrate(poleState, c.Solution[pole]);
        if (pole2 >= 0)
            c.Integrate(pole2State, c.Solution[pole2]);
    }

    public override void LoadReactive(double[] m)
    {
        m[poleSlot] += poleCapacitance;
        if (pole2 >= 0)
            m[pole2Slot] += secondCapacitance;
    }

    public override void CollectNoise(NoiseContext n)
    {
        // Input voltage noise acts like vd, so it enters as g·e_n of current into the pole node.
        var en = amp.VoltageNoiseVoltsPerRootHertz;
        n.Add(Element.Name, "input voltage noise", pole, n.Ground, lastTransconductance * lastTransconductance * en * en, amp.VoltageNoiseCornerHertz);
        var inoise = amp.CurrentNoiseAmperesPerRootHertz;
        n.Add(Element.Name, "non-inverting current noise", plus, n.Ground, inoise * inoise, amp.CurrentNoiseCornerHertz);
        n.Add(Element.Name, "inverting current noise", minus, n.Ground, inoise * inoise, amp.CurrentNoiseCornerHertz);
    }

    /// <summary>
    /// Breaks the loop at the input transconductance for Bode's return ratio: its dependence on vd is
    /// removed from the small-signal matrix and a unit current is injected in its place.
    /// </summary>
    public void BreakLoop(double[] conductances, System.Numerics.Complex[] rhs)
    {
        conductances[poleFromPlus] += lastTransconductance;
        conductances[poleFromMinus] -= lastTransconductance;
        rhs[pole] += 1;
    }

    /// <summary>The return ratio T = −g·vd for the response to the unit injection.</summary>
    public System.Numerics.Complex ReturnRatio(System.Numerics.Complex[] x) => -lastTransconductance * (x[plus] - x[minus]);

    public override void Check(LoadContext c, ICollection<SimulationWarning> warnings)
    {
        CheckPin(c.Solution[plus], amp.NonInverting, warnings);
        CheckPin(c.Solution[minus], amp.Inverting, warnings);
    }

    private void CheckPin(double volts, string node, ICollection<SimulationWarning> warnings)
    {
        if (volts < amp.CommonModeLowVolts || volts > amp.CommonModeHighVolts)
            warnings.Add(new SimulationWarning(Element.Name, node,
                $"input '{node}' at {volts:G6} V is outside the common-mode range {amp.CommonModeLowVolts:G6} V to {amp.CommonModeHighVolts:G6} V"));
    }
}
