namespace ThermVerify.Simulation;

/// <summary>How a transient integrates capacitor voltages and inductor currents between time points.</summary>
public enum IntegrationMethod
{
    /// <summary>
    /// Trapezoidal rule, switched to Gear-2 for the rest of the run when the trapezoidal derivatives ring (alternate
    /// in sign from step to step by more than the error tolerance), which happens on stiff circuits where the rule's
    /// undamped stiff modes get excited; the switch is recorded in <see cref="TransientResult.Notes"/>. The default.
    /// </summary>
    Automatic,

    /// <summary>Trapezoidal rule throughout (order 2, A-stable, not L-stable), with a backward-Euler step after every breakpoint.</summary>
    Trapezoidal,

    /// <summary>Backward Euler throughout (order 1, L-stable); mainly for comparisons.</summary>
    BackwardEuler,

    /// <summary>Gear's second-order backward differentiation formula, BDF2 (order 2, L-stable: stiff modes are damped),
    /// variable step, with backward-Euler steps after every breakpoint.</summary>
    Gear2,
}
