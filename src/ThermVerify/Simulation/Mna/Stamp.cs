using System.Numerics;
using ThermVerify.Circuits;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// How one element enters the MNA system, bound once to matrix slots. Contributions that stay fixed at a
/// given temperature go through <see cref="LoadStatic"/> (added once into a base matrix); everything that
/// changes with the iterate, time or step goes through <see cref="Load"/>. A stamp lives as long as one
/// analysis and may cache values for it; the element record it came from never changes.
/// </summary>
internal abstract class Stamp(Element element)
{
    public Element Element { get; } = element;

    /// <summary>The stamp's static part changes with the circuit temperature.</summary>
    public virtual bool DependsOnTemperature => false;

    /// <summary>The stamp has a <see cref="Load"/> part (sources, reactive and nonlinear elements).</summary>
    public virtual bool HasLoad => false;

    /// <summary>The stamp's load depends on the iterate: Newton iterations are needed.</summary>
    public virtual bool IsNonlinear => false;

    /// <summary>
    /// Whether the last <see cref="Load"/>'s linearisation is the element itself, to far below any tolerance, everywhere
    /// between the iterate it was made at and <paramref name="next"/>: then the solve that gave <paramref name="next"/>
    /// solved the nonlinear equations too, and Newton needs no iteration to confirm it. False unless a stamp can show it.
    /// </summary>
    public virtual bool LinearisationExact(LoadContext context, double[] next) => false;

    /// <summary>The stamp keeps integrated states and wants <see cref="Accept"/> after each converged point.</summary>
    public virtual bool IsReactive => false;

    public virtual void SetTemperature(double celsius) { }

    public virtual void LoadStatic(double[] matrix) { }

    public virtual void Load(LoadContext context) { }

    /// <summary>Records the converged point into the integrated states.</summary>
    public virtual void Accept(LoadContext context) { }

    public virtual void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into) { }

    /// <summary>The stamp overrides <see cref="Check"/>.</summary>
    public virtual bool HasChecks => false;

    /// <summary>Checks a converged point for conditions worth a warning (not an error).</summary>
    public virtual void Check(LoadContext context, ICollection<SimulationWarning> warnings) { }

    /// <summary>Current through the element in its own positive direction at a solution, NaN if it has none.</summary>
    public virtual double CurrentAmperes(double[] solution) => double.NaN;

    /// <summary>Whether <see cref="SetSweepValue"/> is supported; its meaning is the element's main value.</summary>
    public virtual string? SweepQuantity => null;

    /// <summary>Replaces the element's main value for a DC sweep (source value, resistance).</summary>
    public virtual void SetSweepValue(double value) =>
        throw new CircuitException($"{Element.Describe} has no single value a DC sweep can vary; sweep a source or a resistor.");

    /// <summary>Adds the reactive part B of the small-signal matrix G + jωB (capacitances, −inductances).</summary>
    public virtual void LoadReactive(double[] matrix) { }

    /// <summary>Adds the element's AC excitation phasor to the right-hand side.</summary>
    public virtual void LoadAcExcitation(Complex[] rhs) { }

    /// <summary>Declares the element's noise sources (as current sources between two unknowns) at the operating point.</summary>
    public virtual void CollectNoise(NoiseContext noise) { }

    /// <summary>Names the extra unknowns' equations in messages.</summary>
    public override string ToString() => Element.Describe;
}
