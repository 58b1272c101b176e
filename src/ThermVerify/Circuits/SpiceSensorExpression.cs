using ThermVerify.Sensors;

namespace ThermVerify.Circuits;

/// <summary>
/// A sensor resistor in a SPICE deck: the Beta and IEC 60751 models as expressions of <c>temper</c>
/// (so a <c>.dc temp</c> sweep follows them); other models as their value at the circuit temperature,
/// with a comment saying so.
/// </summary>
internal static class SpiceSensorExpression
{
    public static void Write(SensorResistor element, SpiceDeckBuilder deck)
    {
        static string N(double v) => SpiceDeckBuilder.Number(v);
        var name = SpiceDeckBuilder.Name('R', element.Name);
        switch (element.Sensor)
        {
            case BetaThermistor beta:
                deck.Card($"{name} {element.NodeA} {element.NodeB} r='{N(beta.R0Ohms)}*exp({N(beta.Beta)}*(1/(temper+273.15)-1/({N(beta.T0Celsius)}+273.15)))'");
                return;
            case PlatinumRtd rtd:
                // Powers as products: SPICE's ^ is not defined for every negative base.
                deck.Card($"{name} {element.NodeA} {element.NodeB} r='{N(rtd.R0Ohms)}*(1+({N(rtd.CoefficientA)})*temper+({N(rtd.CoefficientB)})*temper*temper" +
                    $"+(temper<0 ? ({N(rtd.CoefficientC)})*(temper-100)*temper*temper*temper : 0))'");
                return;
            default:
                deck.Comment($"{element.Name}: {element.Sensor.Description}; written at the circuit temperature, a temperature sweep will not follow it");
                deck.Card($"{name} {element.NodeA} {element.NodeB} {N(element.ResistanceOhmsAt(deck.TemperatureCelsius))}");
                return;
        }
    }
}
