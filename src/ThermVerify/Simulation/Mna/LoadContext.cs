namespace ThermVerify.Simulation.Mna;

/// <summary>
/// The run state an analysis hands to every stamp while loading: the matrix and right-hand side being
/// assembled, the present iterate, time, integration coefficients and the integrated states.
/// Owned by the analysis; stamps only read it and add into <see cref="Matrix"/> and <see cref="Rhs"/>.
/// </summary>
internal sealed class LoadContext(MnaLayout layout, int stateCount)
{
    public double[] Matrix { get; } = new double[layout.MatrixLength];

    public double[] Rhs { get; } = new double[layout.VectorLength];

    /// <summary>The iterate the loads linearise about; its ground cell is always 0.</summary>
    public double[] Solution { get; set; } = new double[layout.VectorLength];

    public AnalysisMode Mode { get; set; } = AnalysisMode.Dc;

    /// <summary>True while the start of a transient is solved with capacitors held at their initial voltages.</summary>
    public bool HoldInitialConditions { get; set; }

    /// <summary>Time of the point being solved (the start time in DC).</summary>
    public double TimeSeconds { get; set; }

    /// <summary>Length of the step ending at <see cref="TimeSeconds"/> (0 in DC).</summary>
    public double StepSeconds { get; set; }

    /// <summary>A time inside the present step, for states that are constant within a step (switches).</summary>
    public double StepMidTimeSeconds => TimeSeconds - 0.5 * StepSeconds;

    /// <summary>Scale of every independent source, below 1 during source stepping.</summary>
    public double SourceFactor { get; set; } = 1;

    /// <summary>Conductance from every node to ground during gmin stepping (0 otherwise).</summary>
    public double DiagonalGmin { get; set; }

    /// <summary>Conductance across every junction, as SPICE adds (1e-12 S).</summary>
    public double JunctionGmin { get; set; } = 1e-12;

    /// <summary>Whether op-amps limit their clamp and input-stage steps between Newton iterations (see <see cref="Newton.Solve"/>).</summary>
    public bool OpAmpLimiting { get; set; } = true;

    /// <summary>Set by a nonlinear stamp that limited its step; the iterate is then not converged.</summary>
    public bool Limited { get; set; }

    public double TemperatureCelsius { get; set; } = 25;

    /// <summary>
    /// ẋ_n = Ag0·x_n + Ag1·x_n−1 + Ag2·x_n−2 (− ẋ_n−1 when <see cref="Trapezoidal"/>): the integration formula of the
    /// step (see <see cref="StepFormulas"/>); all 0 in DC.
    /// </summary>
    public double Ag0 { get; set; }

    public double Ag1 { get; set; }

    public double Ag2 { get; set; }

    public bool Trapezoidal { get; set; }

    /// <summary>State values two accepted points back (x_n−2, one per state), for Gear-2.</summary>
    public double[] OlderStateValues { get; set; } = new double[stateCount];

    /// <summary>Integrated states [value, derivative] at the point being solved.</summary>
    public double[] State { get; set; } = new double[2 * stateCount];

    /// <summary>States at the last accepted point.</summary>
    public double[] PreviousState { get; set; } = new double[2 * stateCount];

    public MnaLayout Layout => layout;

    /// <summary>The part of ẋ_n that does not depend on x_n, for the state at <paramref name="s"/>.</summary>
    public double History(int s) =>
        Ag1 * PreviousState[s] + (Ag2 != 0 ? Ag2 * OlderStateValues[s / 2] : 0) - (Trapezoidal ? PreviousState[s + 1] : 0);

    /// <summary>Stores a converged state value and its derivative by the present integration formula.</summary>
    public void Integrate(int s, double value)
    {
        State[s] = value;
        State[s + 1] = Mode == AnalysisMode.Dc ? 0 : Ag0 * value + History(s);
    }
}
