namespace ThermVerify.Simulation.Switched;

/// <summary>
/// What the linear model leaves out of an op-amp's slew-limited input stage: the stage delivers
/// g_m·s·tanh(v_d/s) into its pole node (s = SR/(2π·GBW)), the linear model g_m·v_d, so the residual current
/// g_m·(s·tanh(v_d/s) − v_d) is injected into the pole node on top of the linear model. <see cref="IntervalMap"/> carries
/// its effect on the state to first order (a convolution with the linear model's own exponential) and judges the
/// effect on the node voltages where a value can be read, instead of the residual's size at each instant.
/// </summary>
/// <param name="Monitor">Index of the input-difference monitor (the value v_d) among the assembly's monitors.</param>
/// <param name="Pole">The pole node's unknown: the residual is a current into its row.</param>
internal sealed record SlewResidual(string Element, int Monitor, int Pole, double Transconductance, double Scale)
{
    /// <summary>The residual current at input difference v_d (exact, not its cubic approximation).</summary>
    public double Current(double inputVolts) => Transconductance * (Scale * Math.Tanh(inputVolts / Scale) - inputVolts);
}
