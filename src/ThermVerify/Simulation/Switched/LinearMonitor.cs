namespace ThermVerify.Simulation.Switched;

/// <summary>
/// A quantity that must stay within [<see cref="Low"/>, <see cref="High"/>] for the linear model to hold:
/// q = Σ coefficient·x[index] + <see cref="Constant"/> over the MNA unknowns x.
/// </summary>
internal sealed record LinearMonitor(string Element, string Condition, int[] Indices, double[] Coefficients, double Constant, double Low, double High);
