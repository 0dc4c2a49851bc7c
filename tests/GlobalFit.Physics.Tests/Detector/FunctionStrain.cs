using GlobalFit.Physics.Detector;

namespace GlobalFit.Physics.Tests.Detector;

/// <summary>A plane wave given by two functions of retarded time, for tests.</summary>
internal sealed class FunctionStrain(Func<double, double> plus, Func<double, double> cross) : IPlaneWaveStrain
{
    public (double Plus, double Cross) At(double retardedTimeSeconds) => (plus(retardedTimeSeconds), cross(retardedTimeSeconds));
}
