namespace Sibyl.Training.Specs;

/// <summary>
/// A user's program that supplies the linear spectrum of each point: it reads the point's parameters as one
/// JSON object on stdin and writes rows "k P" of the general-relativity P_L(k, z = 0), k in h/Mpc and P in
/// (Mpc/h)³, covering [<paramref name="KMin"/>, <paramref name="KMax"/>] (see training-grids/README.md).
/// </summary>
/// <param name="Command">Program and its arguments, run without a shell.</param>
/// <param name="TimeoutSeconds">Wall-clock limit per point; the program is killed after it.</param>
/// <param name="KMin">Lower end of the table the loop integrals use, h/Mpc.</param>
/// <param name="KMax">Upper end, h/Mpc.</param>
public sealed record ExternalLinearCommand(IReadOnlyList<string> Command, double TimeoutSeconds, double KMin, double KMax);
