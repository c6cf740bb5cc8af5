import { BrowserRouter, Route, Routes } from 'react-router';

// Each feature contributes its pages here; features never import each other.
export function AppRouter() {
  return (
    <BrowserRouter>
      <Routes>
        <Route path="*" element={<main className="p-8 text-title">Arcbench</main>} />
      </Routes>
    </BrowserRouter>
  );
}
