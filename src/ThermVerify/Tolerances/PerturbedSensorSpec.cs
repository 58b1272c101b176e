using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.Tolerances;

/// <summary>
/// The sensor of one built unit: the design's sensor section with its own, already built model. It stands in for
/// the nominal section, so every circuit a design builds (DC sweep, sampling, switch-on) carries this unit's sensor.
/// </summary>
internal sealed record PerturbedSensorSpec : SensorSpec
{
    private readonly ISensorModel model;

    public PerturbedSensorSpec(SensorSpec nominal, ISensorModel model)
    {
        Nominal = nominal;
        this.model = model;
        DissipationConstantWattsPerKelvin = nominal.DissipationConstantWattsPerKelvin;
    }

    public SensorSpec Nominal { get; }

    public override string ModelName => Nominal.ModelName;

    public override ISensorModel Build() => model;
}
