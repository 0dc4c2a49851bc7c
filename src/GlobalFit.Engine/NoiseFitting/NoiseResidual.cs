using System.Numerics;
using GlobalFit.Physics.Series;

namespace GlobalFit.Engine.NoiseFitting;

/// <summary>What the noise worker fits in one update: the full residual (data minus every source template) over its
/// bins, in the continuous-transform convention of <see cref="FourierTransform"/>.</summary>
/// <param name="Bins">The worker's <see cref="NoiseWorker.Bins"/>.</param>
/// <param name="A">Residual, channel A, <paramref name="Bins"/>.Count values.</param>
/// <param name="E">Residual, channel E.</param>
/// <param name="T">Residual, channel T, given exactly when the worker fits T.</param>
/// <remarks>Read during <see cref="NoiseWorker.Update"/> only; the worker keeps no reference.</remarks>
public sealed record NoiseResidual(BinWindow Bins, Complex[] A, Complex[] E, Complex[]? T);
