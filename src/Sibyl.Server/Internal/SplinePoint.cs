namespace Sibyl.Server.Internal;

/// <summary>
/// Where one abscissa falls on a <see cref="KnotSpline"/>: its interval and the four weights of the cubic there,
/// S = A y_j + B y_(j+1) + Ca M_j + Cb M_(j+1). Computed once per requested k, reused for every series.
/// </summary>
internal readonly record struct SplinePoint(int Interval, double A, double B, double Ca, double Cb);
