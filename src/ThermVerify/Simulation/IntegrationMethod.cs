namespace ThermVerify.Simulation;

public enum IntegrationMethod
{
    /// <summary>Trapezoidal rule (order 2, A-stable), with a backward-Euler step after every breakpoint.</summary>
    Trapezoidal,

    /// <summary>Backward Euler throughout (order 1, L-stable); mainly for comparisons.</summary>
    BackwardEuler,
}
